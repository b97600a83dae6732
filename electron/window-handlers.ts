// The intents about the window itself: the page reports its project's state (the
// desktop shell titles the window, enables its menu items and asks before closing
// with unsaved changes), and closes the window once the close prompt's Save is done.
// Arguments are checked here (valibot); the window is the host's (HostContext.window).
import * as v from 'valibot';
import type { HostIntents, ProjectState } from './api-contract.ts';
import type { HostContext } from './host-context.ts';
import { HandlerError } from './handler-error.ts';
import { schemaProblem } from './io/project/schema-issue.ts';

/** Longest project title taken: a file name (255) with room to spare, well under what a title bar shows. */
export const MAX_TITLE_LENGTH = 1024;

const projectStateSchema = v.strictObject({
  title: v.pipe(v.string(), v.maxLength(MAX_TITLE_LENGTH, `a title of at most ${MAX_TITLE_LENGTH} characters`)),
  hasProject: v.boolean(),
  hasUnsavedChanges: v.boolean(),
  canUndo: v.boolean(),
  canRedo: v.boolean(),
});

/** The validated project state; throws HandlerError 'bad-arguments' naming the field. */
export function projectStateArguments(raw: unknown): ProjectState {
  const result = v.safeParse(projectStateSchema, raw);
  if (!result.success) {
    const { where, problem } = schemaProblem(result.issues, 'this request does not take it');
    throw new HandlerError('bad-arguments', `The request "reportProjectState" was refused: ${where ?? 'the arguments'} is wrong (${problem}). This is a bug in the app: please report it.`);
  }
  return result.output;
}

export function reportProjectState(args: HostIntents['reportProjectState']['args'], context: HostContext): Record<string, never> {
  context.window.projectStateChanged(args);
  return {};
}

export function closeWindow(_args: HostIntents['closeWindow']['args'], context: HostContext): { closed: boolean } {
  return { closed: context.window.close() };
}
