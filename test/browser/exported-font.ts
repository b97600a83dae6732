// What every browser test that exports a font checks of the file: it is there, it
// is an OpenType font with CFF outlines, and the OpenType Sanitizer accepts it (or,
// where ots-sanitize is not installed, the test says that check was skipped).
import { expect, type TestInfo } from '@playwright/test';
import { existsSync, readFileSync } from 'node:fs';
import { checkRequirement, OTS_SANITIZE } from '../support/require-tool.ts';
import { otsSanitize } from '../font/ots.ts';

/** The OpenType tag that opens a font with CFF outlines (OpenType spec, "Organization of an OpenType Font"). */
const CFF_SFNT_TAG = 'OTTO';

const ots = checkRequirement(OTS_SANITIZE);

/** Checks the exported font at `path` and returns its bytes. */
export function expectAcceptedCffFont(path: string, testInfo: TestInfo): Buffer {
  expect(existsSync(path)).toBe(true);
  const bytes = readFileSync(path);
  expect(bytes.subarray(0, 4).toString('latin1')).toBe(CFF_SFNT_TAG);
  if (ots.available) {
    // Reference: ots-sanitize (Debian opentype-sanitizer), the checks Chromium applies to web fonts.
    const result = otsSanitize(new Uint8Array(bytes));
    expect(result.passed, result.output).toBe(true);
  } else testInfo.annotations.push({ type: 'skipped check', description: ots.message });
  return bytes;
}
