// Turns the first problem valibot found in a project (or in a handler's argument)
// into words for the message: where it is, as a dotted path ("glyphs.3.advanceWidth"),
// and what is wrong with it. valibot's own wording ("Invalid key: Expected
// "tolerance" but received undefined") is written for programmers; a missing field
// is called missing, a value of the wrong kind is named with what it should be.
import type * as v from 'valibot';

export interface SchemaProblem {
  /** Dotted path of the field, or null for the value as a whole. */
  readonly where: string | null;
  /** What is wrong, to follow "… is wrong: ". */
  readonly problem: string;
}

/** Longest stretch of a received value quoted back: enough to recognise it, never a whole scan. */
const MAX_QUOTED_CHARACTERS = 60;

type Issue = v.BaseIssue<unknown>;

/** How valibot's own messages begin ("Invalid type: Expected …"), as opposed to those a schema gives. */
const VALIBOT_DEFAULT_MESSAGE = 'Invalid ';

function dotPath(issue: Issue): string | null {
  const keys = issue.path?.map((item) => String(item.key));
  return keys !== undefined && keys.length > 0 ? keys.join('.') : null;
}

function quoted(received: string): string {
  return received.length > MAX_QUOTED_CHARACTERS ? `${received.slice(0, MAX_QUOTED_CHARACTERS)}…` : received;
}

/**
 * The first of `issues` in words; `issues` is valibot's non-empty list.
 * `unexpectedField` is what to say of a field the schema does not have.
 */
export function schemaProblem(issues: readonly Issue[], unexpectedField = 'there is no such field in a project'): SchemaProblem {
  const issue = issues[0];
  if (issue === undefined) return { where: null, problem: 'it is not what a project holds' };
  const where = dotPath(issue);
  // A message the schema wrote itself ("a code point at most 10FFFF") is kept; valibot's defaults start "Invalid ".
  if (!issue.message.startsWith(VALIBOT_DEFAULT_MESSAGE)) return { where, problem: issue.message };
  if (issue.input === undefined && issue.kind === 'schema') return { where, problem: 'it is missing' };
  if (issue.expected === 'never') return { where, problem: unexpectedField };
  if (issue.kind === 'schema' && issue.expected !== null) return { where, problem: `it must be ${issue.expected}, not ${quoted(issue.received)}` };
  return { where, problem: issue.message };
}

/**
 * `value` as JSON for a message, cut to MAX_QUOTED_CHARACTERS; "missing" for
 * undefined, and a description for a value nested too deeply to write out (JSON.stringify
 * overflows its stack on a few thousand levels).
 */
export function quotedJson(value: unknown): string {
  if (value === undefined) return 'missing';
  try {
    return quoted(JSON.stringify(value));
  } catch {
    return 'a value nested too deeply to show';
  }
}

/** `text` cut to MAX_QUOTED_CHARACTERS for a message. */
export function quotedText(text: string): string {
  return quoted(text);
}
