// Saving a font to disk: the file holds exactly the written font, replaces what was
// there, and a source that cannot make a font leaves the old file untouched.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { FontError } from '../../electron/io/font/font-error.ts';
import { saveFont } from '../../electron/io/font/write-font-file.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { TEST_FONT } from './sample-fonts.ts';

describe('saving a font file', () => {
  it('writes the font’s bytes, replacing an older file, and leaves no temporary file behind', async () => {
    const directory = mkdtempSync(join(tmpdir(), 'stemline-save-'));
    const path = join(directory, 'Test.otf');
    writeFileSync(path, 'an older file');
    await saveFont(path, TEST_FONT);
    expect(Buffer.from(readFileSync(path)).equals(Buffer.from(writeOtf(TEST_FONT)))).toBe(true);
    expect(readdirSync(directory)).toEqual(['Test.otf']);
  });

  it('keeps the previous file when the source cannot make a font', async () => {
    const directory = mkdtempSync(join(tmpdir(), 'stemline-save-'));
    const path = join(directory, 'Test.otf');
    writeFileSync(path, 'the previous font');
    await expect(saveFont(path, { ...TEST_FONT, ascender: -5 })).rejects.toBeInstanceOf(FontError);
    expect(readFileSync(path, 'utf8')).toBe('the previous font');
    expect(readdirSync(directory)).toEqual(['Test.otf']);
  });
});
