// The demo intent: the demo project's sheets (electron/demo/) read from the host's
// demo folder and sent to the window as PNG bytes with their characters, so the app
// can open on real work — the scan imported, its letters assigned and fitted —
// through the same steps a user takes with their own scans.
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { DemoProject } from './api-contract.ts';
import { HandlerError } from './handler-error.ts';
import type { HostContext } from './host-context.ts';
import { DEMO_SHEETS_FOLDER, readDemoManifest } from './demo/demo-files.ts';

/** How to draw the sheets again, for every message about missing or damaged ones. */
const REGENERATE = 'Run "npx tsx electron/demo/generate-demo-sheets.ts" in the Stemline folder to draw them again, or start a new project from your own scans.';

/** The demo project from the context's demo folder, or null when this host offers no demo. Throws HandlerError when its files are missing or damaged. */
export async function openDemo(_args: Record<string, never>, context: HostContext): Promise<DemoProject | null> {
  if (context.demoFolder === null) return null;
  const folder = context.demoFolder ?? DEMO_SHEETS_FOLDER;
  let manifest;
  try {
    manifest = await readDemoManifest(folder);
  } catch (error) {
    throw new HandlerError('demo-missing', `The demo project could not be opened: ${error instanceof Error ? error.message : String(error)}`);
  }
  const sheets = [];
  for (const sheet of manifest.sheets) {
    let bytes: Buffer;
    try {
      bytes = await readFile(join(folder, sheet.png));
    } catch {
      throw new HandlerError('demo-missing', `The demo's sheet ${sheet.png} is missing from ${folder}. ${REGENERATE}`);
    }
    sheets.push({ name: sheet.png, base64: bytes.toString('base64'), characters: sheet.characters });
  }
  return { title: manifest.title, description: manifest.description, familyName: manifest.familyName, sheets };
}
