// The keyboard-shortcut table of the user guide (docs/guide/04-editing.md) against the
// app's key bindings, so that the guide cannot list a key the app does not answer, or
// leave out one it does. The page's bindings are not one table: each screen compares
// event.key in its own keydown handler, so the handlers' source is read here (which
// keys each file compares, and whether with Ctrl/Cmd held). The desktop menus' keys are
// one table, electron/shell/menu-template.ts, and are read from it.
import { readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { menuTemplate, type MenuEntry, type MenuSection, type MenuState } from '../../electron/shell/menu-template.ts';
import { codeSpans, guideChapter, PROJECT_ROOT, projectFile, tableRows } from './guide-text.ts';

/** Where a shortcut applies, as the guide's "where" column names it, and the files whose keydown handlers answer it. */
const PAGE_PLACES: Readonly<Record<string, readonly string[]>> = {
  window: ['renderer/src/App.svelte'],
  sheet: ['renderer/src/screens/SheetView.svelte'],
  letter: ['renderer/src/editor/LetterCanvas.svelte'],
  field: ['renderer/src/editor/SpacingFields.svelte', 'renderer/src/editor/FontHeights.svelte'],
  dialog: ['renderer/src/screens/FontExportChooser.svelte', 'renderer/src/screens/WorkspaceChooser.svelte'],
};
const MENU_PLACE = 'menu';

/** The guide's names for keys whose event.key is a word or another symbol. */
const KEY_NAMES: Readonly<Record<string, string>> = {
  '←': 'ArrowLeft',
  '→': 'ArrowRight',
  '↑': 'ArrowUp',
  '↓': 'ArrowDown',
  Space: ' ',
  Delete: 'Delete',
  Backspace: 'Backspace',
  Enter: 'Enter',
  Escape: 'Escape',
};
/** The guide's entry for "whatever character is typed", answered through SheetView's isTypedCharacter. */
const ANY_CHARACTER = 'any character';

interface Shortcut {
  readonly ctrl: boolean;
  readonly shift: boolean;
  /** The event.key compared (lower case for letters, as the handlers compare them), or ANY_CHARACTER. */
  readonly key: string;
}

/** "Shift+Ctrl+Z" → { ctrl, shift, key: 'z' }; "+" → the plus key. Throws on a name the guide should not use. */
function parseShortcut(text: string): Shortcut {
  if (text === ANY_CHARACTER) return { ctrl: false, shift: false, key: ANY_CHARACTER };
  const parts = text === '+' ? ['+'] : text.split('+');
  const last = parts[parts.length - 1]!;
  const modifiers = parts.slice(0, -1);
  for (const m of modifiers) if (m !== 'Ctrl' && m !== 'Shift') throw new Error(`unknown modifier "${m}" in \`${text}\``);
  const key = KEY_NAMES[last] ?? ([...last].length === 1 ? last.toLowerCase() : null);
  if (key === null) throw new Error(`unknown key "${last}" in \`${text}\``);
  return { ctrl: modifiers.includes('Ctrl'), shift: modifiers.includes('Shift'), key };
}

/** An Electron accelerator ("CmdOrCtrl+Shift+C", "Plus", "Delete") as a Shortcut. */
function parseAccelerator(accelerator: string): Shortcut {
  const parts = accelerator === '+' ? ['+'] : accelerator.split('+');
  const last = parts[parts.length - 1]!;
  const modifiers = parts.slice(0, -1);
  return {
    ctrl: modifiers.some((m) => m === 'CmdOrCtrl' || m === 'Ctrl' || m === 'Cmd'),
    shift: modifiers.includes('Shift'),
    key: last === 'Plus' ? '+' : (KEY_NAMES[last] ?? last.toLowerCase()),
  };
}

function same(a: Shortcut, b: Shortcut): boolean {
  return a.ctrl === b.ctrl && a.shift === b.shift && a.key === b.key;
}

function describeShortcut(s: Shortcut): string {
  return `${s.ctrl ? 'Ctrl+' : ''}${s.shift ? 'Shift+' : ''}${s.key === ' ' ? 'Space' : s.key}`;
}

interface Binding {
  readonly key: string;
  /** Compared with Ctrl (or Cmd) held: on a line testing `mod &&` or `(event.ctrlKey || event.metaKey) &&`. */
  readonly ctrl: boolean;
}

/** A line that compares a key only while Ctrl or Cmd is held. */
const CTRL_HELD = /(?<![!\w])mod\s*&&|\(event\.ctrlKey \|\| event\.metaKey\)\s*&&/;
/** A comparison of the pressed key with a literal: event.key === 'Enter', key === 'z', event.key.toLowerCase() === 's'. */
const KEY_COMPARISON = /\bkey(?:\.toLowerCase\(\))?\s*===\s*'([^']*)'/g;

/**
 * The keys a component's handlers compare, each with whether Ctrl/Cmd must be held.
 * Keys looked up in a table (`event.key in ARROWS`) count with the table's own keys.
 */
function bindingsIn(source: string): Binding[] {
  const found: Binding[] = [];
  for (const line of source.split('\n')) {
    const ctrl = CTRL_HELD.test(line);
    for (const match of line.matchAll(KEY_COMPARISON)) found.push({ key: match[1]!, ctrl });
    const table = /event\.key in (\w+)/.exec(line);
    if (table) {
      const body = new RegExp(`const ${table[1]}\\b[^=]*=\\s*\\{([^}]*)\\}`).exec(source);
      if (!body) throw new Error(`the key table ${table[1]} is not defined in the same file`);
      for (const entry of body[1]!.matchAll(/(\w+)\s*:/g)) found.push({ key: entry[1]!, ctrl });
    }
  }
  return found;
}

/** Whether a file answers `shortcut`: the key compared with Ctrl held or not as the shortcut says, and shift read when it needs shift. */
function answers(source: string, shortcut: Shortcut): boolean {
  if (shortcut.key === ANY_CHARACTER) return /isTypedCharacter\(event\.key\)/.test(source);
  const bound = bindingsIn(source).some((b) => b.key === shortcut.key && b.ctrl === shortcut.ctrl);
  return bound && (!shortcut.shift || /\bshiftKey\b/.test(source));
}

/** Every entry of a menu, submenus included, with the label of its top-level menu. */
function menuEntries(sections: readonly MenuSection[]): { menu: string; entry: MenuEntry }[] {
  const all: { menu: string; entry: MenuEntry }[] = [];
  const walk = (menu: string, entries: readonly MenuEntry[]) => {
    for (const entry of entries) {
      all.push({ menu, entry });
      if (entry.kind === 'submenu') walk(menu, entry.entries);
    }
  };
  for (const section of sections) walk(section.label, section.entries);
  return all;
}

const BASE_STATE: Omit<MenuState, 'platform'> = { hasWindow: true, hasProject: true, hasUnsavedChanges: true, canUndo: true, canRedo: true, recent: [] };
const MENUS = { linux: menuTemplate({ ...BASE_STATE, platform: 'linux' }), mac: menuTemplate({ ...BASE_STATE, platform: 'darwin' }) };

/** Menu entries with a key: their accelerator, label, top-level menu, and whether the page answers the key itself. */
function acceleratedEntries(sections: readonly MenuSection[]) {
  return menuEntries(sections).flatMap(({ menu, entry }) =>
    (entry.kind === 'command' || entry.kind === 'action') && entry.accelerator !== undefined
      ? [{ menu, label: entry.label, shortcut: parseAccelerator(entry.accelerator), pageHandlesKey: entry.kind === 'command' && entry.pageHandlesKey === true }]
      : [],
  );
}

interface GuideRow {
  readonly shortcuts: Shortcut[];
  readonly place: string;
  readonly what: string;
  readonly line: string;
}

const rows: GuideRow[] = tableRows(guideChapter('04-editing.md'), ['keys', 'where', 'what it does']).map(([keys, place, what]) => ({
  shortcuts: codeSpans(keys!).map(parseShortcut),
  place: place!,
  what: what!,
  line: `| ${keys} | ${place} | ${what} |`,
}));

describe('the guide\'s keyboard shortcuts', () => {
  it('lists a table of shortcuts, each row with keys and a known place', () => {
    expect(rows.length).toBeGreaterThan(20);
    for (const row of rows) {
      expect(row.shortcuts.length, row.line).toBeGreaterThan(0);
      expect([...Object.keys(PAGE_PLACES), MENU_PLACE], row.line).toContain(row.place);
    }
  });

  it('lists only keys that the screen it names answers', () => {
    for (const row of rows.filter((r) => r.place !== MENU_PLACE)) {
      for (const shortcut of row.shortcuts) {
        for (const file of PAGE_PLACES[row.place]!) {
          expect(answers(projectFile(file), shortcut), `${describeShortcut(shortcut)} is listed for "${row.place}" but ${file} does not answer it: ${row.line}`).toBe(true);
        }
      }
    }
  });

  it('knows every renderer file that compares the pressed key', () => {
    const files = readdirSync(join(PROJECT_ROOT, 'renderer/src'), { recursive: true, withFileTypes: true })
      .filter((f) => f.isFile() && /\.(svelte|ts)$/.test(f.name))
      .map((f) => relative(PROJECT_ROOT, join(f.parentPath, f.name)))
      .filter((path) => bindingsIn(projectFile(path)).length > 0);
    expect(files.length).toBeGreaterThan(0);
    for (const file of files) expect(Object.values(PAGE_PLACES).flat(), `${file} answers keys; add it to PAGE_PLACES and its keys to the guide`).toContain(file);
  });

  it('leaves out no key that a screen answers', () => {
    for (const [place, files] of Object.entries(PAGE_PLACES)) {
      const listed = rows.filter((r) => r.place === place).flatMap((r) => r.shortcuts);
      for (const file of files) {
        for (const binding of bindingsIn(projectFile(file))) {
          const documented = listed.some((s) => s.key === binding.key && s.ctrl === binding.ctrl);
          expect(documented, `${file} answers ${binding.ctrl ? 'Ctrl+' : ''}"${binding.key}" but the guide lists no such key for "${place}"`).toBe(true);
        }
      }
    }
  });

  it('lists each menu key with the menu item it runs, as the desktop menus define them', () => {
    const entries = [...acceleratedEntries(MENUS.linux), ...acceleratedEntries(MENUS.mac)];
    for (const row of rows.filter((r) => r.place === MENU_PLACE)) {
      for (const shortcut of row.shortcuts) {
        const entry = entries.find((e) => same(e.shortcut, shortcut) && !e.pageHandlesKey);
        expect(entry, `no desktop menu item has the key ${describeShortcut(shortcut)}: ${row.line}`).toBeDefined();
        expect(row.what, `the menu item with ${describeShortcut(shortcut)} is ${entry!.menu} ▸ ${entry!.label}`).toContain(`${entry!.menu} ▸ ${entry!.label}`);
      }
    }
  });

  it('lists every key of the desktop menus: menu-only keys as menu rows, the keys the page answers under its screens', () => {
    for (const [platform, sections] of Object.entries(MENUS)) {
      for (const entry of acceleratedEntries(sections)) {
        const listed = entry.pageHandlesKey
          ? rows.filter((r) => r.place !== MENU_PLACE).some((r) => r.shortcuts.some((s) => same(s, entry.shortcut)))
          : rows.filter((r) => r.place === MENU_PLACE).some((r) => r.shortcuts.some((s) => same(s, entry.shortcut)));
        // macOS's Redo is Cmd+Shift+Z, which the guide lists as Shift+Ctrl+Z ("Cmd wherever Ctrl is listed").
        expect(listed, `${platform}: ${entry.menu} ▸ ${entry.label} (${describeShortcut(entry.shortcut)}) is not in the guide's shortcut table`).toBe(true);
      }
    }
  });
});
