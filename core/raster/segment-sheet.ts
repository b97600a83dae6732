// Segmentation of a sheet of letters into individual letters, in reading order. A
// lettering artist draws an alphabet (or a word) on one page; the font needs one glyph
// per letter, so the separate pieces of ink must be grouped — the dot of an i or j, an
// accent, the halves of a stroke that broke on the scan — while letters that stand side
// by side stay apart. Rows and their baselines come out of the same analysis, and the
// characters the artist typed are assigned to the letters in reading order.

import { boundingBox } from './polygon-measures.ts';
import type { Box, Contour } from './types.ts';

/**
 * A component is a letter body (rather than a mark such as a dot, accent or fragment)
 * when it is at least this fraction of the typical letter height. Chosen: the dot of an
 * i is about 0.15–0.2 of a cap height and an acute accent about 0.3, while the shortest
 * letters (x-height letters next to capitals and ascenders) are about 0.6–0.7.
 */
const BODY_HEIGHT_FRACTION = 0.4;
/**
 * Two pieces whose horizontal extents overlap by at least this fraction of the
 * narrower one are parts of one letter (a stroke broken across its width, the two
 * storeys of a letter). Side-by-side letters, even kerned, overlap far less. Chosen.
 */
const SAME_LETTER_OVERLAP_FRACTION = 0.5;
/**
 * A mark joins a letter only if the vertical gap between them is at most this fraction
 * of the typical letter height (accents sit a small fraction of a cap height above
 * the letter; the next row is a whole line away). Chosen.
 */
const MARK_MAX_GAP_FRACTION = 0.5;
/**
 * Two bodies stacked one above the other are the halves of one broken stroke only if
 * the crack between them is at most this fraction of the letter height: a broken
 * stroke leaves a hairline gap, while a descender and the ascender below it in the
 * next row are a good part of a line apart. Chosen.
 */
const BROKEN_STROKE_MAX_GAP_FRACTION = 0.15;

export interface SheetLetter {
  /** Position in reading order, 0-based. */
  readonly index: number;
  /** Bounding box of all the letter's ink (pixel frame). */
  readonly box: Box;
  /** Indices into the contour array of every contour of the letter (outlines, holes, islands), ascending. */
  readonly contours: number[];
  /** Index of the letter's row. */
  readonly row: number;
  /** Character assigned from the user's text, or null. */
  readonly character: string | null;
}

export interface SheetRow {
  readonly index: number;
  /** Top and bottom of all ink in the row (pixel frame, y down). */
  readonly top: number;
  readonly bottom: number;
  /** Estimated baseline y (see segmentSheet). */
  readonly baseline: number;
}

export interface SheetSegmentation {
  readonly letters: SheetLetter[];
  readonly rows: SheetRow[];
  /** Typical letter height used for the size rules, in px. */
  readonly letterHeight: number;
  readonly notes: string[];
}

export interface SegmentSheetOptions {
  /**
   * The characters drawn on the sheet, in reading order. Whitespace is skipped, so
   * "ABC abc" may be typed with the line break or a space between rows. Grapheme
   * clusters count as one character ("é" typed as e + combining accent is one).
   */
  readonly characters?: string;
}

/** One ink component: a depth-0 outline with all its descendants. */
interface Piece {
  readonly contours: number[];
  readonly box: Box;
  readonly body: boolean;
}

interface LetterDraft {
  pieces: Piece[];
  /** Union of the body pieces' boxes (marks are matched against bodies only). */
  bodyBox: Box;
  row: number;
}

interface RowDraft {
  top: number;
  bottom: number;
  letters: LetterDraft[];
}

/**
 * Groups nested contours (as from nestContours) into letters.
 *
 * Rules, in order:
 * 1. Each depth-0 contour with all its descendants is one piece.
 * 2. The typical letter height is the median height of the taller half of the pieces
 *    (dots, accents and specks are short, so they cannot pull it down even when they
 *    are half of all pieces). Pieces at least 0.4 of it are bodies, the rest marks.
 * 3. Bodies whose horizontal extents overlap by half the narrower width and that are
 *    at most 0.15 letter heights apart vertically are one letter (a stroke broken
 *    across its width); other bodies are separate letters.
 * 4. Letters form rows: taken by vertical centre, a letter joins the current row when
 *    its centre lies within the row's vertical extent, otherwise it starts a new row.
 * 5. Each mark joins the letter, in any row, that overlaps it horizontally and is
 *    vertically nearest to it, if that gap is at most half a letter height (dots,
 *    accents, small fragments); ties go to the larger horizontal overlap. A mark with
 *    no such letter is punctuation: marks of that kind overlapping each other
 *    horizontally in the same row (a colon) form one letter, and each such letter
 *    joins the row nearest to it.
 * 6. Rows are ordered top to bottom and letters left to right within a row.
 * 7. A row's baseline is the median of the bottoms of its letters' bodies (common
 *    practice in layout analysis: the median has a 50 % breakdown point). It is exact
 *    as long as fewer than half of the row's letters descend below the baseline
 *    (g j p q y) or overshoot it noticeably; a row of only descenders gets the
 *    descender line. Marks (a cedilla) and punctuation do not take part.
 * 8. Characters of `options.characters` are assigned in reading order; surplus letters
 *    get null and surplus characters are reported in `notes`.
 */
export function segmentSheet(contours: readonly Contour[], options: SegmentSheetOptions = {}): SheetSegmentation {
  const notes: string[] = [];
  const pieces = collectPieces(contours);
  if (pieces.length === 0) {
    notes.push('There is no ink to segment into letters.');
    return { letters: [], rows: [], letterHeight: 0, notes };
  }
  const letterHeight = typicalLetterHeight(pieces.map((piece) => piece.box.height));
  const classified = pieces.map((piece) => ({ ...piece, body: piece.box.height >= BODY_HEIGHT_FRACTION * letterHeight }));
  const bodies = classified.filter((piece) => piece.body);
  const marks = classified.filter((piece) => !piece.body);

  const rows = buildRows(bodies, letterHeight);
  const orphans: Piece[] = [];
  for (const mark of marks) {
    const target = bestLetterForMark(rows, mark, letterHeight);
    if (target === null) orphans.push(mark);
    else target.pieces.push(mark);
  }
  placeOrphanMarks(rows, orphans);

  rows.sort((a, b) => a.top - b.top);
  const letters: SheetLetter[] = [];
  const sheetRows: SheetRow[] = [];
  const characters = splitCharacters(options.characters ?? '');
  for (let r = 0; r < rows.length; r++) {
    const row = rows[r]!;
    row.letters.sort((a, b) => letterBox(a).x - letterBox(b).x);
    let top = Infinity;
    let bottom = -Infinity;
    const bodyBottoms: number[] = [];
    for (const letter of row.letters) {
      const box = letterBox(letter);
      top = Math.min(top, box.y);
      bottom = Math.max(bottom, box.y + box.height);
      if (letter.pieces.some((piece) => piece.body)) bodyBottoms.push(letter.bodyBox.y + letter.bodyBox.height);
      const index = letters.length;
      letters.push({
        index,
        box,
        contours: letter.pieces.flatMap((piece) => piece.contours).sort((a, b) => a - b),
        row: r,
        character: characters[index] ?? null,
      });
    }
    sheetRows.push({ index: r, top, bottom, baseline: bodyBottoms.length > 0 ? median(bodyBottoms) : bottom });
  }

  if (characters.length > 0 && characters.length < letters.length) {
    notes.push(`The text has ${characters.length} character(s) for ${letters.length} letters; the last ${letters.length - characters.length} letter(s) have no character yet.`);
  } else if (characters.length > letters.length) {
    const unused = characters.slice(letters.length).join('');
    notes.push(`The text has ${characters.length} characters but only ${letters.length} letters were found; "${unused}" was not assigned. Check for letters that touch (they count as one) or for missing letters.`);
  }
  return { letters, rows: sheetRows, letterHeight, notes };
}

function collectPieces(contours: readonly Contour[]): Piece[] {
  const resolveRoot = (index: number): number => {
    let node = index;
    let guard = contours.length;
    while (contours[node]!.parent !== -1 && guard-- > 0) node = contours[node]!.parent;
    return node;
  };
  const members = new Map<number, number[]>();
  for (let i = 0; i < contours.length; i++) {
    const root = resolveRoot(i);
    const list = members.get(root);
    if (list === undefined) members.set(root, [i]);
    else list.push(i);
  }
  const pieces: Piece[] = [];
  for (const [root, list] of members) {
    pieces.push({ contours: list, box: boundingBox(contours[root]!.points), body: false });
  }
  return pieces;
}

/** Median height of the taller half of the pieces (rule 2). */
function typicalLetterHeight(heights: readonly number[]): number {
  const descending = [...heights].sort((a, b) => b - a);
  return median(descending.slice(0, Math.ceil(descending.length / 2)));
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}

function horizontalOverlap(a: Box, b: Box): number {
  return Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
}

function verticalGap(a: Box, b: Box): number {
  return Math.max(0, a.y - (b.y + b.height), b.y - (a.y + a.height));
}

function unionBox(a: Box, b: Box): Box {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, width: Math.max(a.x + a.width, b.x + b.width) - x, height: Math.max(a.y + a.height, b.y + b.height) - y };
}

function letterBox(letter: LetterDraft): Box {
  return letter.pieces.map((piece) => piece.box).reduce(unionBox);
}

function sameLetter(a: Box, b: Box): boolean {
  return horizontalOverlap(a, b) >= SAME_LETTER_OVERLAP_FRACTION * Math.min(a.width, b.width);
}

/** Rules 3 and 4: letters from bodies, then rows of letters. */
function buildRows(bodies: readonly Piece[], letterHeight: number): RowDraft[] {
  // Rule 3: union-find over bodies that are halves of one broken stroke.
  const parent = bodies.map((_, index) => index);
  const root = (index: number): number => {
    let node = index;
    while (parent[node] !== node) node = parent[node] = parent[parent[node]!]!;
    return node;
  };
  const maxGap = BROKEN_STROKE_MAX_GAP_FRACTION * letterHeight;
  // Sorted by left edge, a body can only overlap the bodies that start before it ends.
  const byLeft = bodies.map((_, index) => index).sort((a, b) => bodies[a]!.box.x - bodies[b]!.box.x);
  for (let i = 0; i < byLeft.length; i++) {
    const a = byLeft[i]!;
    const boxA = bodies[a]!.box;
    for (let j = i + 1; j < byLeft.length; j++) {
      const b = byLeft[j]!;
      const boxB = bodies[b]!.box;
      if (boxB.x >= boxA.x + boxA.width) break;
      if (sameLetter(boxA, boxB) && verticalGap(boxA, boxB) <= maxGap) parent[root(b)] = root(a);
    }
  }
  const clusters = new Map<number, LetterDraft>();
  bodies.forEach((body, index) => {
    const key = root(index);
    const letter = clusters.get(key);
    if (letter === undefined) clusters.set(key, { pieces: [body], bodyBox: body.box, row: -1 });
    else {
      letter.pieces.push(body);
      letter.bodyBox = unionBox(letter.bodyBox, body.box);
    }
  });

  // Rule 4: rows by vertical centre.
  const byCentre = [...clusters.values()].sort((a, b) => centreY(a.bodyBox) - centreY(b.bodyBox));
  const rows: RowDraft[] = [];
  for (const letter of byCentre) {
    const current = rows[rows.length - 1];
    const centre = centreY(letter.bodyBox);
    if (current !== undefined && centre >= current.top && centre <= current.bottom) {
      letter.row = rows.length - 1;
      current.letters.push(letter);
      current.top = Math.min(current.top, letter.bodyBox.y);
      current.bottom = Math.max(current.bottom, letter.bodyBox.y + letter.bodyBox.height);
    } else {
      letter.row = rows.length;
      rows.push({ top: letter.bodyBox.y, bottom: letter.bodyBox.y + letter.bodyBox.height, letters: [letter] });
    }
  }
  return rows;
}

function centreY(box: Box): number {
  return box.y + box.height / 2;
}

/** Rule 5: the letter a mark belongs to, or null. */
function bestLetterForMark(rows: readonly RowDraft[], mark: Piece, letterHeight: number): LetterDraft | null {
  let best: LetterDraft | null = null;
  let bestGap = Infinity;
  let bestOverlap = -Infinity;
  for (const row of rows) {
    for (const letter of row.letters) {
      const overlap = horizontalOverlap(letter.bodyBox, mark.box);
      if (overlap <= 0) continue;
      const gap = verticalGap(letter.bodyBox, mark.box);
      if (gap > MARK_MAX_GAP_FRACTION * letterHeight) continue;
      if (gap < bestGap || (gap === bestGap && overlap > bestOverlap)) {
        best = letter;
        bestGap = gap;
        bestOverlap = overlap;
      }
    }
  }
  return best;
}

/** Rule 5, second half: marks that joined no letter become letters of their own. */
function placeOrphanMarks(rows: RowDraft[], orphans: readonly Piece[]): void {
  const orphanLetters: LetterDraft[] = [];
  for (const mark of [...orphans].sort((a, b) => a.box.x - b.box.x)) {
    const row = nearestRow(rows, mark.box);
    const match = orphanLetters.find((letter) => letter.row === row && sameLetter(letter.bodyBox, mark.box));
    if (match === undefined) orphanLetters.push({ pieces: [mark], bodyBox: mark.box, row });
    else {
      match.pieces.push(mark);
      match.bodyBox = unionBox(match.bodyBox, mark.box);
    }
  }
  for (const letter of orphanLetters) {
    const row = rows[letter.row];
    if (row === undefined) rows.push({ top: letter.bodyBox.y, bottom: letter.bodyBox.y + letter.bodyBox.height, letters: [letter] });
    else row.letters.push(letter);
  }
}

function nearestRow(rows: readonly RowDraft[], box: Box): number {
  const centre = box.y + box.height / 2;
  let best = -1;
  let bestDistance = Infinity;
  rows.forEach((row, index) => {
    const distance = Math.max(0, row.top - centre, centre - row.bottom);
    if (distance < bestDistance) {
      bestDistance = distance;
      best = index;
    }
  });
  return best;
}

/** The user's characters without whitespace, one entry per grapheme cluster, in NFC: the unit assigned to one letter. */
export function splitCharacters(text: string): string[] {
  const segmenter = new Intl.Segmenter(undefined, { granularity: 'grapheme' });
  const characters: string[] = [];
  for (const { segment } of segmenter.segment(text.normalize('NFC'))) {
    if (!/^\s+$/u.test(segment)) characters.push(segment);
  }
  return characters;
}
