// The import-scan intent: the desktop app's File ▸ Import scans… asks for the scan in
// the system's open dialog (a page cannot open a file chooser from a menu command:
// Chromium shows one only in answer to a click in the page) and hands its bytes to the
// page, which decodes and traces it as when a scan is chosen in the page. The path
// comes only from the dialog the user answered; browser mode has no such dialog.
import { stat } from 'node:fs/promises';
import { basename } from 'node:path';
import type { HostIntents, ImportedScan } from './api-contract.ts';
import type { HostContext } from './host-context.ts';
import { HandlerError } from './handler-error.ts';
import { readInputFile } from './io/read-input-file.ts';
import { MAX_PROJECT_BYTES } from './io/project/project-file.ts';

/**
 * Largest scan taken: three quarters of the largest project file, since a project
 * embeds its scan in base64 (4 bytes per 3) and must still open again.
 */
export const MAX_SCAN_FILE_BYTES = Math.floor((MAX_PROJECT_BYTES * 3) / 4);

export async function importScan(_args: HostIntents['importScan']['args'], context: HostContext): Promise<ImportedScan | null> {
  const path = await context.projects.places.chooseScanToImport();
  if (path === null) return null;
  const name = basename(path);
  const info = await stat(path).catch(() => null);
  if (info === null || !info.isFile()) throw new HandlerError('project-file', `Could not import ${name}: it is not a file that can be read. Choose the scan again.`);
  if (info.size > MAX_SCAN_FILE_BYTES) {
    throw new HandlerError('project-file', `${name} is larger than the ${Math.round(MAX_SCAN_FILE_BYTES / 2 ** 20)} MiB a scan may have (a project must be able to hold it). Scan at a lower resolution, in greyscale, or crop the sheet.`);
  }
  try {
    return { name, bytes: new Uint8Array(await readInputFile(path)) };
  } catch (error) {
    throw new HandlerError('project-file', `Could not import ${error instanceof Error ? error.message : String(error)} Choose the scan again.`);
  }
}
