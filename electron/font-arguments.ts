// The argument checks of the font intents (valibot): the font's settings and glyphs
// exactly as a project holds them (the project schema's own parts), no more glyphs
// than a font can number, at most MAX_FONT_ARGUMENT_CHARACTERS of JSON, and for an
// export a file name no longer than a file system takes. A refused argument is a
// HandlerError naming the field.
import * as v from 'valibot';
import { HandlerError } from './handler-error.ts';
import { exceedsJsonSize } from './json-size.ts';
import { schemaProblem } from './io/project/schema-issue.ts';
import { MAX_FILE_NAME_LENGTH } from './places/workspace-files.ts';
import { projectSchema } from './io/project/project-schema.ts';
import type { HostIntents, IntentName } from './api-contract.ts';

/**
 * Largest font argument, in characters of JSON as json-size.ts estimates them
 * (which counts every number as 24 characters, so a point costs about 60): 64 MiB,
 * room for a thousand glyphs of a thousand points each, several times any lettering
 * alphabet; an argument beyond it is not the app's and would only tie the host up.
 * The browser host takes request bodies up to the same size for these intents.
 */
export const MAX_FONT_ARGUMENT_CHARACTERS = 64 * 1024 * 1024;

/**
 * Most glyphs a font source may have: a font numbers its glyphs with 16 bits
 * (OpenType 'maxp' numGlyphs, at most 65535), and the writer adds .notdef and a space.
 */
export const MAX_FONT_GLYPHS = 65535 - 2;

const glyphsSchema = v.pipe(projectSchema.entries.glyphs, v.maxLength(MAX_FONT_GLYPHS, `at most ${MAX_FONT_GLYPHS} glyphs, the most a font can number`));
const nameSchema = v.pipe(v.string(), v.minLength(1, 'a file name'), v.maxLength(MAX_FILE_NAME_LENGTH, `a file name of at most ${MAX_FILE_NAME_LENGTH} characters`));

const SCHEMAS = {
  buildProofFont: v.strictObject({ font: projectSchema.entries.font, glyphs: glyphsSchema }),
  exportFont: v.strictObject({ font: projectSchema.entries.font, glyphs: glyphsSchema, name: v.optional(nameSchema) }),
};

type FontIntent = keyof typeof SCHEMAS;

/** The validated arguments of a font intent; throws HandlerError 'bad-arguments'. */
export function fontArguments<K extends FontIntent>(intent: K, raw: unknown): HostIntents[K]['args'] {
  if (exceedsJsonSize(raw, MAX_FONT_ARGUMENT_CHARACTERS)) {
    throw new HandlerError('bad-arguments', `The font's outlines are larger than the ${MAX_FONT_ARGUMENT_CHARACTERS / 2 ** 20} MiB the host takes, so no font was built. Remove glyphs with very many points (refit them with a larger tolerance) and try again.`);
  }
  const result = v.safeParse(SCHEMAS[intent], raw ?? {});
  if (!result.success) {
    const { where, problem } = schemaProblem(result.issues, 'this request does not take it');
    throw new HandlerError('bad-arguments', `The request "${intent satisfies IntentName}" was refused: ${where ?? 'the arguments'} is wrong (${problem}). Undo the last edit and try again; if it persists, please report it.`);
  }
  return result.output as HostIntents[K]['args'];
}
