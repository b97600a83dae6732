// Which window shows a project file the user asked to open (File ▸ Open…, Open recent,
// or a file the system handed the app): one window per project. The window already
// showing it is brought forward; otherwise the focused window takes it if it holds
// nothing yet; otherwise a new window opens for it.

/** What the shell knows of each window. */
export interface WindowFacts {
  id: number;
  /** The project file the window shows (it opened or saved it), or null. */
  projectPath: string | null;
  /** Whether the window holds no work yet: no project file, nothing unsaved, no scan. */
  empty: boolean;
}

export type WindowChoice = { kind: 'focus'; id: number } | { kind: 'open-in'; id: number } | { kind: 'new-window' };

/** The window for `path`, given the windows there are and the focused one (or null). */
export function windowFor(path: string, windows: readonly WindowFacts[], focusedId: number | null): WindowChoice {
  const showing = windows.find((w) => w.projectPath === path);
  if (showing !== undefined) return { kind: 'focus', id: showing.id };
  const focused = windows.find((w) => w.id === focusedId);
  if (focused !== undefined && focused.empty) return { kind: 'open-in', id: focused.id };
  return { kind: 'new-window' };
}
