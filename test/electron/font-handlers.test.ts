// The proof and export intents, with real temporary folders: the proof font is built
// in memory (nothing written) and passes the OpenType Sanitizer browsers apply; the
// export writes an .otf exactly where the user chose — a name inside the browser
// workspace, or the desktop save dialog's answer — says where, and refuses every
// name that would leave the workspace; malformed or huge arguments and glyphs that
// cannot make a font are refused with a message before anything is written.
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { HandlerError } from '../../electron/handler-error.ts';
import { MAX_FONT_ARGUMENT_CHARACTERS, MAX_FONT_GLYPHS } from '../../electron/font-arguments.ts';
import type { FontContent } from '../../electron/api-contract.ts';
import { readFont } from '../../electron/io/font/read-font.ts';
import { OTS_SANITIZE } from '../support/require-tool.ts';
import { describeWith } from '../font/require.ts';
import { otsSanitize } from '../font/ots.ts';
import { browserHostFixture, desktopHostFixture, sampleProject, SECRET_TEXT } from './project-host-fixture.ts';

/** The OpenType tag that opens a font with CFF outlines (OpenType spec, "Organization of an OpenType Font": sfntVersion 'OTTO'). */
const CFF_SFNT_TAG = 'OTTO';

/** The font part of the sample project, as the renderer sends it: "I" of Harbour Signs, plus an "o" with a hole. */
function sampleFont(): FontContent {
  const project = sampleProject();
  const ring = {
    unicodes: ['006F'],
    advanceWidth: 500,
    outline: {
      contours: [
        [[250, 0, 'on-smooth'], [400, 0, 'off'], [450, 150, 'off'], [450, 250, 'on-smooth'], [450, 350, 'off'], [400, 500, 'off'], [250, 500, 'on-smooth'], [100, 500, 'off'], [50, 350, 'off'], [50, 250, 'on-smooth'], [50, 150, 'off'], [100, 0, 'off']],
        [[250, 100, 'on-smooth'], [150, 100, 'off'], [130, 200, 'off'], [130, 250, 'on-smooth'], [130, 300, 'off'], [150, 400, 'off'], [250, 400, 'on-smooth'], [350, 400, 'off'], [370, 300, 'off'], [370, 250, 'on-smooth'], [370, 200, 'off'], [350, 100, 'off']],
      ],
    },
  } satisfies FontContent['glyphs'][number];
  return { font: project.font, glyphs: [...project.glyphs, ring] };
}

function bytesOf(base64: string): Uint8Array {
  return new Uint8Array(Buffer.from(base64, 'base64'));
}

function tagOf(bytes: Uint8Array): string {
  return Buffer.from(bytes.subarray(0, 4)).toString('latin1');
}

async function refusal(promise: Promise<unknown>): Promise<HandlerError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(HandlerError);
  return error as HandlerError;
}

describe('the proof font', () => {
  it('is built in memory from the glyphs sent, mapping their characters and the space, and nothing is written', async () => {
    const host = browserHostFixture();
    const proof = await host.call('buildProofFont', sampleFont());
    const bytes = bytesOf(proof.base64);
    expect(tagOf(bytes)).toBe(CFF_SFNT_TAG);
    expect(proof.characters).toEqual([' ', 'I', 'o']);
    const font = readFont(bytes, 'proof.otf');
    expect(font.familyName).toBe('Harbour Signs');
    expect(font.glyphs.map((g) => g.character).sort()).toEqual(['', ' ', 'I', 'o']);
    expect(readdirSync(host.workspace)).toEqual([]);
  });

  it('follows an edit: a moved point gives other bytes', async () => {
    const host = browserHostFixture();
    const before = await host.call('buildProofFont', sampleFont());
    const edited = sampleFont();
    edited.glyphs[0]!.outline.contours[0]![2]![0] = 260;
    const after = await host.call('buildProofFont', edited);
    expect(after.base64).not.toBe(before.base64);
  });

  it('says which glyph to change when the glyphs cannot make a font', async () => {
    const host = browserHostFixture();
    const content = sampleFont();
    // A glyph for A named like the glyph for I: the writer's own check, passed on with the glyph it names.
    const sameName = { ...content, glyphs: [...content.glyphs, { ...content.glyphs[0]!, unicodes: ['0041'], name: 'I' }] };
    const error = await refusal(host.call('buildProofFont', sameName));
    expect(error.kind).toBe('font-build');
    expect(error.message).toMatch(/^The font could not be built \(glyph "I"\): Glyphs 1 and 3 are both named "I"/);
  });

  it('names the letters of the scan that share a character, and where to fix them, for the proof and the export alike', async () => {
    const host = browserHostFixture();
    const content = sampleFont();
    const i = content.glyphs[0]!;
    // Letters 1 and 27 of the scan both typed "I" (source.letter is the reading-order index).
    const twice = { ...content, glyphs: [...content.glyphs, { ...i, source: { scan: 'scan-1', letter: 26 } }] };
    for (const intent of ['buildProofFont', 'exportFont'] as const) {
      const error = await refusal(host.call(intent, intent === 'exportFont' ? { ...twice, name: 'draft.otf' } : twice));
      expect(error.kind, intent).toBe('font-build');
      expect(error.message, intent).toBe('The font could not be built: “I” is assigned to letters 1 and 27 of the scan, and a font has one glyph per character. Go back to the sheet, where those boxes are marked: select one and type its right character, or, if they are pieces of one letter, select them and merge them. Then fit the letters again.');
    }
    expect(readdirSync(host.workspace)).toEqual([]);
    // A letter of the scan clashing with a glyph imported from a font (no source): both are named.
    const imported = { ...content, glyphs: [...content.glyphs, { unicodes: ['0049'], name: 'I.imported', advanceWidth: 300, outline: { contours: [] } }] };
    expect((await refusal(host.call('buildProofFont', imported))).message).toBe('The font could not be built: “I” belongs to letter 1 of the scan and glyph 3 ("I.imported"), and a font has one glyph per character. Retype that letter on the sheet and fit again.');
  });

  it('refuses malformed arguments, naming the field', async () => {
    const host = browserHostFixture();
    const content = sampleFont();
    const cases: [unknown, RegExp][] = [
      [{ glyphs: content.glyphs }, /"buildProofFont" was refused: font is wrong/],
      [{ font: content.font }, /glyphs is wrong/],
      [{ ...content, path: '/etc/passwd' }, /path is wrong \(this request does not take it\)/],
      [{ ...content, glyphs: [{ ...content.glyphs[0]!, advanceWidth: 'wide' }] }, /glyphs\.0\.advanceWidth is wrong/],
      [{ ...content, glyphs: [{ ...content.glyphs[0]!, outline: { contours: [[[40000, 0, 'on']]] } }] }, /glyphs\.0\.outline\.contours\.0\.0\.0 is wrong/],
      [{ ...content, font: { ...content.font, familyName: '' } }, /font\.familyName is wrong/],
      ['a font', /was refused/],
      [null, /font is wrong/],
    ];
    for (const [args, message] of cases) {
      const error = await refusal(host.call('buildProofFont', args));
      expect(error.kind).toBe('bad-arguments');
      expect(error.message).toMatch(message);
    }
  });

  it('refuses huge arguments: outlines beyond the size limit and more glyphs than a font can number', async () => {
    const host = browserHostFixture();
    const content = sampleFont();
    const huge = await refusal(host.call('buildProofFont', { ...content, font: { ...content.font, styleName: 'x'.repeat(MAX_FONT_ARGUMENT_CHARACTERS + 1) } }));
    expect(huge.kind).toBe('bad-arguments');
    expect(huge.message).toMatch(/larger than the 64 MiB the host takes/);
    const blank = { unicodes: [], advanceWidth: 0, outline: { contours: [] } };
    const many = await refusal(host.call('buildProofFont', { ...content, glyphs: Array.from({ length: MAX_FONT_GLYPHS + 1 }, () => ({ ...blank })) }));
    expect(many.kind).toBe('bad-arguments');
    expect(many.message).toMatch(/glyphs is wrong \(at most 65533 glyphs/);
  });
});

describeWith('the proof font against the OpenType Sanitizer', [OTS_SANITIZE], () => {
  it('passes ots-sanitize, as a browser requires before it uses the font', async () => {
    const host = browserHostFixture();
    // Reference: ots-sanitize from Debian's opentype-sanitizer, the checks Chromium applies to web fonts.
    const result = otsSanitize(bytesOf((await host.call('buildProofFont', sampleFont())).base64));
    expect(result.passed, result.output).toBe(true);
    expect(result.output).toBe('File sanitized successfully!');
  });
});

describe('exporting the font in the browser workspace', () => {
  it('writes the font under the chosen name, adding ".otf", and says where and whether it replaced a file', async () => {
    const host = browserHostFixture();
    const first = await host.call('exportFont', { ...sampleFont(), name: 'harbour' });
    expect(first).toEqual({ name: 'harbour.otf', path: join(host.workspace, 'harbour.otf'), replaced: false });
    const written = new Uint8Array(readFileSync(first!.path));
    expect(tagOf(written)).toBe(CFF_SFNT_TAG);
    expect(Buffer.from(written).toString('base64')).toBe((await host.call('buildProofFont', sampleFont())).base64);
    const again = await host.call('exportFont', { ...sampleFont(), name: 'harbour.OTF' });
    expect(again).toMatchObject({ name: 'harbour.OTF', replaced: false });
    const over = await host.call('exportFont', { ...sampleFont(), name: 'harbour.otf' });
    expect(over).toMatchObject({ name: 'harbour.otf', replaced: true });
    expect(readdirSync(host.workspace).sort()).toEqual(['harbour.OTF', 'harbour.otf']);
  });

  it('refuses names that lead outside the workspace, and writes nothing there', async () => {
    const host = browserHostFixture();
    symlinkSync(host.secret, join(host.workspace, 'escape.otf'));
    const names = ['../outside/secret.stemline', join(host.outside, 'font.otf'), 'sub/font.otf', 'sub\\font.otf', '..', '.', '.hidden.otf', 'C:font.otf', 'nul\u0000.otf', 'escape.otf'];
    for (const name of names) {
      const error = await refusal(host.call('exportFont', { ...sampleFont(), name }));
      expect(error.kind, name).toBe('path-refused');
      expect(error.message, name).toMatch(name === 'escape.otf' ? /is a link to a file outside the workspace folder "workspace", and Stemline writes files only inside it/ : /Choose a font file directly inside the workspace folder "workspace"/);
    }
    expect(readFileSync(host.secret, 'utf8')).toBe(SECRET_TEXT);
    expect(readdirSync(host.outside)).toEqual(['secret.stemline']);
    expect(readdirSync(host.workspace)).toEqual(['escape.otf']);
  });

  it('needs a name chosen in the page, and builds nothing from glyphs that cannot make a font', async () => {
    const host = browserHostFixture();
    expect((await refusal(host.call('exportFont', sampleFont()))).kind).toBe('bad-arguments');
    expect((await refusal(host.call('exportFont', { ...sampleFont(), name: 'x'.repeat(256) }))).kind).toBe('bad-arguments');
    const content = sampleFont();
    const broken = await refusal(host.call('exportFont', { ...content, glyphs: [...content.glyphs, content.glyphs[1]!], name: 'broken' }));
    expect(broken.kind).toBe('font-build');
    expect(readdirSync(host.workspace)).toEqual([]);
  });
});

describe('exporting the font in the desktop app', () => {
  it('writes where the save dialog answered, adding ".otf", after suggesting the family name', async () => {
    const answers = { open: [], save: [], exportFont: [] as (string | null)[] };
    const host = desktopHostFixture(answers);
    answers.exportFont.push(join(host.outside, 'proof'));
    const exported = await host.call('exportFont', sampleFont());
    expect(host.suggested).toEqual(['Harbour Signs.otf']);
    expect(exported).toEqual({ name: 'proof.otf', path: join(host.outside, 'proof.otf'), replaced: false });
    expect(tagOf(new Uint8Array(readFileSync(join(host.outside, 'proof.otf'))))).toBe(CFF_SFNT_TAG);
  });

  it('does nothing when the dialog is cancelled, and refuses a file name sent by the page', async () => {
    const host = desktopHostFixture({ open: [], save: [], exportFont: [null] });
    expect(await host.call('exportFont', sampleFont())).toBeNull();
    const named = await refusal(host.call('exportFont', { ...sampleFont(), name: 'font.otf' }));
    expect(named.kind).toBe('path-refused');
    expect(named.message).toMatch(/chosen in the file dialog/);
    expect(readdirSync(host.outside)).toEqual(['secret.stemline']);
  });

  it('says why a font could not be written and that nothing was', async () => {
    const answers = { open: [], save: [], exportFont: [] as (string | null)[] };
    const host = desktopHostFixture(answers);
    answers.exportFont.push(join(host.root, 'no-such-folder', 'font.otf'));
    const error = await refusal(host.call('exportFont', sampleFont()));
    expect(error.kind).toBe('project-file');
    expect(error.message).toBe('Could not export the font to font.otf: its folder no longer exists. Nothing was written: fix that and export again, or choose another place.');
  });
});
