// `stemline check FONT_OR_PROJECT [--json]`: the outline checks (core/checks) on every
// glyph of a font or a Stemline project — extremes without points, near-miss kinks,
// crossing handles, off-grid points, degenerate segments, wrong contour directions.
// Prints one line per glyph with its warnings; exits 0 whether or not there are any.
import { basename } from 'node:path';
import { checkOutline, type OutlineWarning } from '../../../core/checks/index.ts';
import { outlineFromJson, type GlyphOutline } from '../../../core/outline/index.ts';
import { readFont } from '../../io/font/read-font.ts';
import { parseProject } from '../../io/project/project-file.ts';
import { glyphCharacters } from '../../io/project/font-from-project.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { parseCommandLine } from '../parse-options.ts';
import type { CliCommand } from '../run-cli.ts';
import { EXIT_OK } from '../usage.ts';
import { readInputFile } from '../../io/read-input-file.ts';

const COMMAND = 'check';

interface CheckedGlyph {
  name: string;
  character: string;
  warnings: OutlineWarning[];
}

function loadGlyphs(bytes: Uint8Array, name: string): { glyphs: Array<{ name: string; character: string; outline: GlyphOutline }>; kind: 'font' | 'project' } {
  const firstByte = bytes.find((b) => b !== 0x20 && b !== 0x0a && b !== 0x0d && b !== 0x09);
  if (firstByte === 0x7b) { // "{": a project file
    const project = parseProject(new TextDecoder().decode(bytes), name);
    return { kind: 'project', glyphs: project.glyphs.map((g, i) => ({ name: g.name ?? `glyph ${i + 1}`, character: glyphCharacters(g)[0] ?? '', outline: outlineFromJson(g.outline) })) };
  }
  const font = readFont(bytes, name);
  return { kind: 'font', glyphs: font.glyphs.filter((g) => g.index !== 0).map((g) => ({ name: g.name, character: g.character, outline: g.outline })) };
}

export const checkCommand: CliCommand = {
  name: COMMAND,
  synopsis: 'check FONT_OR_PROJECT [--json]',
  purpose: 'report outline problems a type designer would flag, glyph by glyph',
  options: ['--json                         print every warning as JSON'],
  async run(args, streams) {
    const { values, positionals } = parseCommandLine(COMMAND, args, { json: { type: 'boolean' } });
    const [path, ...extra] = positionals;
    if (path === undefined || extra.length > 0) throw new CliUsageError(`stemline ${COMMAND}: name one font or project, e.g. "stemline ${COMMAND} draft.otf".`);
    const { glyphs, kind } = loadGlyphs(await readInputFile(path), basename(path));
    const checked: CheckedGlyph[] = glyphs.map((g) => ({ name: g.name, character: g.character, warnings: checkOutline(g.outline) }));
    if (values.json === true) {
      streams.out(`${JSON.stringify({ file: path, kind, glyphs: checked }, null, 2)}\n`);
    } else {
      for (const glyph of checked) {
        streams.out(`${glyph.name}\t${glyph.character === '' ? '-' : `U+${(glyph.character.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`}\twarnings ${glyph.warnings.length}\n`);
        for (const warning of glyph.warnings) streams.out(`\t${warning.kind}: ${warning.message}\n`);
      }
    }
    const total = checked.reduce((n, g) => n + g.warnings.length, 0);
    const byKind = new Map<string, number>();
    for (const w of checked.flatMap((g) => g.warnings)) byKind.set(w.kind, (byKind.get(w.kind) ?? 0) + 1);
    const kinds = [...byKind].map(([k, n]) => `${n} ${k}`).join(', ');
    streams.err(`${checked.length} glyphs checked, ${total} warnings${kinds ? ` (${kinds})` : ''}\n`);
    return EXIT_OK;
  },
};
