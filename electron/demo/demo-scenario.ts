// The demo project's story and the sheets it draws. The client, the shop and the
// street are invented for Stemline's demo: Pellworth & Daughters, a grocer on Cinder
// Row, commissioned a hand-lettered alphabet for its new fascia sign and wants it as
// a font for price cards and the shop's menu boards. The lettering artist drew the
// alphabet with a broad nib and scanned the sheet at 600 dpi; Stemline opens on it.

/** What the demo project is, in a line for the window. */
export const DEMO_TITLE = 'Demo: the Pellworth & Daughters sign alphabet';

/** The story behind the demo, shown with it. */
export const DEMO_DESCRIPTION = 'A broad-nib alphabet drawn for the fascia sign of Pellworth & Daughters, grocers on Cinder Row (an invented shop), scanned at 600 dpi and ready to fit.';

/** The font family the demo's letters make. */
export const DEMO_FAMILY_NAME = 'Pellworth Fascia';

/** One sheet of the demo: what is drawn on it, row by row, and the seed it is drawn with. */
export interface DemoSheetSpec {
  /** File name without extension, for the PNG and TIFF copies. */
  readonly name: string;
  /** The characters of each row, left to right. */
  readonly rows: readonly string[];
  /** The seed of every random choice on the sheet (paper, hand, specks). */
  readonly seed: number;
}

/**
 * The demo's sheets. One sheet holds the whole alphabet because the app edits one
 * scan per project: the first screen can show every letter. The punctuation shares
 * the figures' row, so the row's baseline is measured on the figures (a row of
 * mostly dots and commas has too few letters standing on the baseline).
 */
export const DEMO_SHEETS: readonly DemoSheetSpec[] = [
  {
    name: 'pellworth-alphabet',
    rows: ['ABCDEFGHIJKLM', 'NOPQRSTUVWXYZ', 'abcdefghijklm', 'nopqrstuvwxyz', "0123456789&!?.,:-'"],
    seed: 0x7e11_0a4d,
  },
];

/** The characters of a sheet in reading order, rows separated by a space (as Stemline takes them). */
export function sheetCharacters(spec: DemoSheetSpec): string {
  return spec.rows.join(' ');
}
