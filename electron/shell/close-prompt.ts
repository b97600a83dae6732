// What happens when the user closes a window or quits while a project has unsaved
// changes: the window asks Save / Don't save / Cancel. The decision and the prompt's
// wording are plain functions; electron/main.ts shows the prompt and carries out the
// answer (Save asks the page to save and close once saved, so a cancelled save dialog
// leaves the window open with the work in it).
import { APP_NAME } from '../app-identity.ts';

/** What the window reported of its project last (api-contract.ts ProjectState). */
export interface CloseState {
  hasUnsavedChanges: boolean;
  /** The project's title, for the prompt. */
  title: string;
}

/** The buttons of the prompt, in their order; Save is the default, Cancel what Escape picks. */
export const CLOSE_PROMPT_BUTTONS = ['Save', 'Don’t save', 'Cancel'] as const;

export type CloseAnswer = 'save-then-close' | 'close-without-saving' | 'stay-open';

/**
 * Whether closing needs the user's answer first: only when the page reported unsaved
 * changes. A window whose page never reported (it failed to load) closes at once;
 * `confirmed` is set once the user has answered, so the second close goes through.
 */
export function closeNeedsAnswer(state: CloseState | null, confirmed: boolean): boolean {
  return !confirmed && state !== null && state.hasUnsavedChanges;
}

/** The prompt's options for Electron's dialog.showMessageBox. */
export function closePromptOptions(state: CloseState, quitting: boolean) {
  return {
    type: 'warning' as const,
    title: APP_NAME,
    message: `Save the changes to “${state.title}” before ${quitting ? 'quitting' : 'closing'}?`,
    detail: 'If you don’t save, the project file keeps its last saved state; Stemline offers the autosaved changes the next time you open the project.',
    buttons: [...CLOSE_PROMPT_BUTTONS],
    defaultId: 0,
    cancelId: 2,
    noLink: true,
  };
}

/** The answer the button at `index` stands for; anything else (a closed prompt) keeps the window open. */
export function closeAnswerFor(index: number): CloseAnswer {
  if (index === 0) return 'save-then-close';
  if (index === 1) return 'close-without-saving';
  return 'stay-open';
}
