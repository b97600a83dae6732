// Importing a scan from the desktop app's File menu, with real files: the bytes of the
// file the open dialog answered reach the page unchanged; a cancelled dialog, a folder,
// a relative answer, an oversized file and arguments the intent does not take are
// each refused with a message; browser mode has no such dialog and says so.
import { describe, expect, it } from 'vitest';
import { mkdirSync, truncateSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { HandlerError } from '../../electron/handler-error.ts';
import { MAX_SCAN_FILE_BYTES } from '../../electron/scan-import-handler.ts';
import { browserHostFixture, desktopHostFixture, SCAN_BYTES } from './project-host-fixture.ts';

async function refusal(promise: Promise<unknown>): Promise<HandlerError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(HandlerError);
  return error as HandlerError;
}

describe('importing a scan through the open dialog', () => {
  it('hands the page the bytes and name of the file the dialog answered', async () => {
    const answers = { open: [], save: [], scan: [] as (string | null)[] };
    const host = desktopHostFixture(answers);
    const scan = join(host.outside, 'sheet-1.png');
    writeFileSync(scan, SCAN_BYTES);
    answers.scan.push(scan);
    const imported = await host.call('importScan', {});
    expect(imported?.name).toBe('sheet-1.png');
    expect([...imported!.bytes]).toEqual([...SCAN_BYTES]);
  });

  it('does nothing when the user cancels', async () => {
    expect(await desktopHostFixture({ open: [], save: [], scan: [null] }).call('importScan', {})).toBeNull();
  });

  it('refuses a folder, a relative answer and a file larger than a project can hold, saying what to do', async () => {
    const host = desktopHostFixture({ open: [], save: [] });
    const folder = join(host.root, 'scans.png');
    mkdirSync(folder);
    const huge = join(host.root, 'huge.tif');
    writeFileSync(huge, '');
    truncateSync(huge, MAX_SCAN_FILE_BYTES + 1); // sparse: no disk is used
    const cases: [string, string, RegExp][] = [
      [folder, 'project-file', /not a file that can be read\. Choose the scan again/],
      ['relative/sheet.png', 'path-refused', /not a full path/],
      [huge, 'project-file', /larger than the 384 MiB a scan may have .* lower resolution/],
    ];
    for (const [answer, kind, message] of cases) {
      const error = await refusal(desktopHostFixture({ open: [], save: [], scan: [answer] }).call('importScan', {}));
      expect(error.kind, answer).toBe(kind);
      expect(error.message).toMatch(message);
    }
  });

  it('refuses arguments: the page never names the scan', async () => {
    const host = desktopHostFixture({ open: [], save: [], scan: ['/etc/passwd'] });
    for (const args of [{ path: '/etc/passwd' }, ['x'], 'sheet.png']) expect((await refusal(host.call('importScan', args))).kind).toBe('bad-arguments');
  });

  it('in browser mode refuses, since the page chooses scans itself', async () => {
    const error = await refusal(browserHostFixture().call('importScan', {}));
    expect(error.kind).toBe('path-refused');
    expect(error.message).toMatch(/scans are chosen in the page/);
  });
});
