// Atomic writes (electron/io/atomic-write.ts): the target is replaced whole, and the
// temporary files a killed write left behind are cleared by a later write of the same
// file once they are old enough to belong to no write still running.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { STALE_TEMPORARY_MS, writeFileAtomic } from '../../electron/io/atomic-write.ts';

describe('atomic writes', () => {
  it('clears leftover temporaries of the same file once they are stale, and nothing else', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'stemline-atomic-'));
    const target = join(folder, 'alphabet.stemline');
    const stale = join(folder, '.alphabet.stemline.0123456789ab.tmp');
    const fresh = join(folder, '.alphabet.stemline.ba9876543210.tmp');
    const otherFile = join(folder, '.other.stemline.0123456789ab.tmp');
    const notOurs = join(folder, '.alphabet.stemline.notes.tmp');
    for (const file of [stale, fresh, otherFile, notOurs]) writeFileSync(file, 'half a save');
    const old = (Date.now() - 2 * STALE_TEMPORARY_MS) / 1000;
    for (const file of [stale, otherFile, notOurs]) utimesSync(file, old, old);

    await writeFileAtomic(target, 'the whole project');

    expect(readFileSync(target, 'utf8')).toBe('the whole project');
    expect(readdirSync(folder).sort()).toEqual(['.alphabet.stemline.ba9876543210.tmp', '.alphabet.stemline.notes.tmp', '.other.stemline.0123456789ab.tmp', 'alphabet.stemline'].sort());
  });
});
