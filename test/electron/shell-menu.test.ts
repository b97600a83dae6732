// The desktop shell's menus and window decisions, read from the plain functions
// electron/main.ts builds them with: the menu for each state of the focused window,
// the commands it sends (exactly the contract's closed set), the close prompt, which
// window a project file opens in, and which command-line arguments are project files.
import { describe, expect, it } from 'vitest';
import { MENU_COMMANDS } from '../../electron/api-contract.ts';
import { commandsIn, menuTemplate, RECENT_MENU_LENGTH, type MenuEntry, type MenuSection, type MenuState } from '../../electron/shell/menu-template.ts';
import { closeAnswerFor, closeNeedsAnswer, closePromptOptions, CLOSE_PROMPT_BUTTONS } from '../../electron/shell/close-prompt.ts';
import { windowFor } from '../../electron/shell/window-choice.ts';
import { projectFilesIn } from '../../electron/shell/launch-files.ts';

const IDLE: MenuState = { hasWindow: true, hasProject: false, hasUnsavedChanges: false, canUndo: false, canRedo: false, recent: [], platform: 'linux' };

function entry(sections: readonly MenuSection[], label: string): MenuEntry {
  for (const section of sections) {
    const stack = [...section.entries];
    while (stack.length > 0) {
      const item = stack.shift()!;
      if ('label' in item && item.label === label) return item;
      if (item.kind === 'submenu') stack.push(...item.entries);
    }
  }
  throw new Error(`no menu item "${label}"`);
}

function enabled(sections: readonly MenuSection[], label: string): boolean {
  const item = entry(sections, label);
  return 'enabled' in item ? item.enabled !== false : true;
}

describe('the application menu', () => {
  it('has File, Edit, View and Help, with the items the desktop issue lists', () => {
    const menu = menuTemplate(IDLE);
    expect(menu.map((s) => s.label)).toEqual(['File', 'Edit', 'View', 'Help']);
    for (const label of ['New project', 'Open…', 'Open recent', 'Save', 'Save as…', 'Import scans…', 'Export font…', 'Close window']) expect(entry(menu, label)).toBeDefined();
    for (const label of ['Undo', 'Redo', 'Select all', 'Delete']) expect(entry(menu, label)).toBeDefined();
    for (const label of ['Zoom in', 'Zoom out', 'Curvature combs', 'Scan backdrop']) expect(entry(menu, label)).toBeDefined();
    for (const label of ['Stemline user guide', 'About Stemline']) expect(entry(menu, label)).toBeDefined();
  });

  it('sends exactly the contract’s closed set of commands (the close prompt sends save-and-close)', () => {
    const sent = new Set([...commandsIn(menuTemplate(IDLE)), ...commandsIn(menuTemplate({ ...IDLE, platform: 'darwin' })), 'save-and-close']);
    expect([...sent].sort()).toEqual([...MENU_COMMANDS].sort());
  });

  it('puts the app menu first on macOS, with Quit there instead of in File', () => {
    const menu = menuTemplate({ ...IDLE, platform: 'darwin' });
    expect(menu.map((s) => s.label)).toEqual(['Stemline', 'File', 'Edit', 'View', 'Help']);
    expect(menu[0]!.entries).toContainEqual({ kind: 'role', role: 'quit' });
    expect(() => entry(menu.slice(1), 'Quit')).toThrow();
    expect(entry(menuTemplate(IDLE), 'Quit')).toMatchObject({ kind: 'action', action: 'quit' });
  });

  it('enables Save only with unsaved changes, Undo and Redo only when the editor can, Export only with a project', () => {
    const idle = menuTemplate(IDLE);
    expect(enabled(idle, 'Save')).toBe(false);
    expect(enabled(idle, 'Undo')).toBe(false);
    expect(enabled(idle, 'Redo')).toBe(false);
    expect(enabled(idle, 'Export font…')).toBe(false);
    const busy = menuTemplate({ ...IDLE, hasProject: true, hasUnsavedChanges: true, canUndo: true, canRedo: true });
    for (const label of ['Save', 'Undo', 'Redo', 'Export font…', 'Proof']) expect(enabled(busy, label), label).toBe(true);
  });

  it('without a window keeps only what needs none: a new project, Open…, the guide, About', () => {
    const menu = menuTemplate({ ...IDLE, hasWindow: false, hasProject: true, hasUnsavedChanges: true, canUndo: true });
    for (const label of ['Save', 'Save as…', 'Undo', 'Import scans…', 'Zoom in', 'Close window']) expect(enabled(menu, label), label).toBe(false);
    for (const label of ['New project', 'Open…', 'Stemline user guide', 'About Stemline']) expect(enabled(menu, label), label).toBe(true);
  });

  it('lists recent projects by name and folder, most recent first, at most the kept number, with a way to clear them', () => {
    const recent = Array.from({ length: RECENT_MENU_LENGTH + 3 }, (_, i) => ({ name: `p${i}.stemline`, folder: 'lettering' }));
    const submenu = entry(menuTemplate({ ...IDLE, recent }), 'Open recent');
    expect(submenu.kind).toBe('submenu');
    const items = (submenu as Extract<MenuEntry, { kind: 'submenu' }>).entries;
    const listed = items.filter((i) => i.kind === 'recent');
    expect(listed).toHaveLength(RECENT_MENU_LENGTH);
    expect(listed[0]).toEqual({ kind: 'recent', label: 'p0.stemline — lettering', index: 0 });
    expect(items.at(-1)).toMatchObject({ kind: 'action', action: 'clear-recent', enabled: true });
    const none = entry(menuTemplate(IDLE), 'Open recent') as Extract<MenuEntry, { kind: 'submenu' }>;
    expect(none.entries).toEqual([{ kind: 'action', label: 'No recent projects', action: 'clear-recent', enabled: false }]);
  });

  it('leaves the keys the page answers itself to the page, so one key press never acts twice', () => {
    const menu = menuTemplate({ ...IDLE, hasUnsavedChanges: true, canUndo: true, canRedo: true });
    // The page answers Ctrl+S / Shift+Ctrl+S (App.svelte), Ctrl+Z / Ctrl+Y, + / − and Delete (the letter canvas).
    for (const label of ['Save', 'Save as…', 'Undo', 'Redo', 'Zoom in', 'Zoom out', 'Delete']) expect(entry(menu, label), label).toMatchObject({ pageHandlesKey: true });
    for (const label of ['Import scans…', 'Select all', 'Curvature combs']) expect(entry(menu, label), label).not.toHaveProperty('pageHandlesKey');
  });

  it('gives no two items the same shortcut', () => {
    for (const platform of ['linux', 'darwin', 'win32'] as const) {
      const keys: string[] = [];
      const walk = (entries: readonly MenuEntry[]) => {
        for (const item of entries) {
          if ((item.kind === 'command' || item.kind === 'action') && item.accelerator) keys.push(item.accelerator);
          if (item.kind === 'submenu') walk(item.entries);
        }
      };
      for (const section of menuTemplate({ ...IDLE, platform })) walk(section.entries);
      expect(new Set(keys).size, platform).toBe(keys.length);
    }
  });
});

describe('the unsaved-changes prompt on close and quit', () => {
  const dirty = { hasUnsavedChanges: true, title: 'harbour' };

  it('asks only when the window reported unsaved changes, and once answered lets the close through', () => {
    expect(closeNeedsAnswer(dirty, false)).toBe(true);
    expect(closeNeedsAnswer(dirty, true)).toBe(false);
    expect(closeNeedsAnswer({ ...dirty, hasUnsavedChanges: false }, false)).toBe(false);
    expect(closeNeedsAnswer(null, false)).toBe(false); // a page that never loaded has nothing to lose
  });

  it('offers Save (the default), Don’t save and Cancel (what Escape picks), naming the project and whether closing or quitting', () => {
    const closing = closePromptOptions(dirty, false);
    expect(closing.buttons).toEqual([...CLOSE_PROMPT_BUTTONS]);
    expect(closing.buttons[closing.defaultId]).toBe('Save');
    expect(closing.buttons[closing.cancelId]).toBe('Cancel');
    expect(closing.message).toBe('Save the changes to “harbour” before closing?');
    expect(closePromptOptions(dirty, true).message).toMatch(/before quitting\?$/);
  });

  it('maps each button to its answer, and a prompt closed any other way keeps the window', () => {
    expect([0, 1, 2, -1, 7].map(closeAnswerFor)).toEqual(['save-then-close', 'close-without-saving', 'stay-open', 'stay-open', 'stay-open']);
  });
});

describe('one window per project', () => {
  const windows = [
    { id: 1, projectPath: '/home/ann/harbour.stemline', empty: false },
    { id: 2, projectPath: null, empty: true },
    { id: 3, projectPath: null, empty: false },
  ];

  it('brings forward the window already showing the file', () => {
    expect(windowFor('/home/ann/harbour.stemline', windows, 2)).toEqual({ kind: 'focus', id: 1 });
  });

  it('opens it in the focused window when that holds nothing yet, else in a new window', () => {
    expect(windowFor('/home/ann/sign.stemline', windows, 2)).toEqual({ kind: 'open-in', id: 2 });
    expect(windowFor('/home/ann/sign.stemline', windows, 3)).toEqual({ kind: 'new-window' });
    expect(windowFor('/home/ann/sign.stemline', windows, null)).toEqual({ kind: 'new-window' });
  });
});

describe('project files handed over by the system', () => {
  it('takes the project files among the arguments, resolved against the starting folder, each once', () => {
    const argv = ['/opt/Stemline/stemline', '--no-sandbox', '.', 'harbour.stemline', '/data/Sign.STEMLINE', 'notes.txt', 'harbour.stemline', '--flag=x.stemline'];
    expect(projectFilesIn(argv, '/home/ann')).toEqual(['/home/ann/harbour.stemline', '/data/Sign.STEMLINE']);
  });

  it('takes nothing when there is no project file (a plain start)', () => {
    expect(projectFilesIn(['/opt/Stemline/stemline', '/work/main'], '/home/ann')).toEqual([]);
  });
});
