// `stemline import FONT -o PROJECT`: an existing OTF, TTF or WOFF font as a new
// Stemline project (outlines converted to cubics, metrics and names kept).
import { basename } from 'node:path';
import { readFont } from '../../io/font/read-font.ts';
import { readInputFile } from '../../io/read-input-file.ts';
import { projectFromFont } from '../../io/project/project-from-font.ts';
import { saveProject } from '../../io/project/project-file.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { parseCommandLine } from '../parse-options.ts';
import type { CliCommand } from '../run-cli.ts';
import { EXIT_OK } from '../usage.ts';

const COMMAND = 'import';

export const importCommand: CliCommand = {
  name: COMMAND,
  synopsis: 'import FONT -o PROJECT.stemline',
  purpose: 'make a Stemline project from an existing OTF, TTF or WOFF font',
  options: ['-o, --output PROJECT.stemline   where to write the project'],
  async run(args, streams) {
    const { values, positionals } = parseCommandLine(COMMAND, args, { output: { type: 'string', short: 'o' } });
    const [fontPath, ...extra] = positionals;
    if (fontPath === undefined || extra.length > 0) throw new CliUsageError(`stemline ${COMMAND}: name one font, e.g. "stemline ${COMMAND} reference.otf -o reference.stemline".`);
    if (values.output === undefined) throw new CliUsageError(`stemline ${COMMAND}: say where to write the project with -o PROJECT.stemline.`);
    const font = readFont(await readInputFile(fontPath), basename(fontPath));
    const project = projectFromFont(font);
    await saveProject(values.output, project);
    streams.err(`wrote ${values.output}: ${font.familyName} ${font.styleName}, ${project.glyphs.length} glyphs, ${font.unitsPerEm} units per em (${font.outlineFormat === 'truetype' ? 'TrueType outlines converted to cubics' : 'CFF outlines'})\n`);
    return EXIT_OK;
  },
};
