// Runs the OpenType Sanitizer (Debian opentype-sanitizer), the same checks
// Chromium and Firefox apply before they use a web font: a font it rejects is a
// font a browser refuses ("OTS parsing error").
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { OTS_SANITIZE } from '../support/require-tool.ts';

export interface OtsResult {
  readonly passed: boolean;
  /** What ots-sanitize printed. */
  readonly output: string;
}

/** Sanitizes `bytes` with ots-sanitize; passed means exit status 0. */
export function otsSanitize(bytes: Uint8Array): OtsResult {
  const directory = mkdtempSync(join(tmpdir(), 'stemline-ots-'));
  try {
    const input = join(directory, 'font.otf');
    writeFileSync(input, bytes);
    const run = spawnSync(OTS_SANITIZE.path, [input, join(directory, 'sanitized.otf')], { encoding: 'utf8' });
    return { passed: run.status === 0, output: `${run.stdout}${run.stderr}`.trim() };
  } finally {
    rmSync(directory, { recursive: true, force: true });
  }
}
