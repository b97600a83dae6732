// The demo intent: both hosts send the demo project's shipped sheet byte for byte,
// with the characters drawn on it, so the window can open on it; a host started
// without the demo says so with null; missing sheets are refused with a message that
// says how to draw them again; and the intent takes no arguments.
import { describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { invokeHandler } from '../../electron/handlers.ts';
import { DEMO_MANIFEST_NAME, DEMO_SHEETS_FOLDER } from '../../electron/demo/demo-files.ts';
import { DEMO_SHEETS, sheetCharacters } from '../../electron/demo/demo-scenario.ts';
import type { DemoProject } from '../../electron/api-contract.ts';
import { browserHostFixture, desktopHostFixture } from './project-host-fixture.ts';

const browser = browserHostFixture().context;
const desktop = desktopHostFixture({ open: [], save: [] }).context;

describe('the demo intent', () => {
  it('sends the shipped sheet exactly, with its characters in reading order, in both hosts', async () => {
    for (const context of [browser, desktop]) {
      const demo = (await invokeHandler('openDemo', {}, context)) as DemoProject;
      expect(demo.title).toMatch(/^Demo: /);
      expect(demo.sheets).toHaveLength(DEMO_SHEETS.length);
      const sheet = demo.sheets[0]!;
      expect(sheet.name).toBe(`${DEMO_SHEETS[0]!.name}.png`);
      expect(sheet.characters).toBe(sheetCharacters(DEMO_SHEETS[0]!));
      expect(Buffer.from(sheet.base64, 'base64').equals(readFileSync(join(DEMO_SHEETS_FOLDER, sheet.name)))).toBe(true);
    }
  });

  it('answers null where the host was started without the demo', async () => {
    expect(await invokeHandler('openDemo', {}, { ...browser, demoFolder: null })).toBeNull();
  });

  it('says how to draw the sheets again when they are missing', async () => {
    const empty = mkdtempSync(join(tmpdir(), 'stemline-demo-'));
    await expect(invokeHandler('openDemo', {}, { ...browser, demoFolder: empty })).rejects.toMatchObject({ kind: 'demo-missing', message: expect.stringContaining('generate-demo-sheets.ts') });
    // The manifest without its sheet: the missing file is named.
    copyFileSync(join(DEMO_SHEETS_FOLDER, DEMO_MANIFEST_NAME), join(empty, DEMO_MANIFEST_NAME));
    await expect(invokeHandler('openDemo', {}, { ...browser, demoFolder: empty })).rejects.toMatchObject({ kind: 'demo-missing', message: expect.stringContaining(`${DEMO_SHEETS[0]!.name}.png is missing`) });
  });

  it('takes no arguments', async () => {
    await expect(invokeHandler('openDemo', { path: '/etc' }, browser)).rejects.toMatchObject({ kind: 'bad-arguments' });
  });
});
