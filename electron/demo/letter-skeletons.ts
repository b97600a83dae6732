// The pen paths of the demo alphabet: for every character the skeleton a broad nib
// follows, one string per pen stroke (the pen lifts between strings), in a small
// SVG-like syntax: "M x y" moves, "L x y" draws a line, "C x1 y1 x2 y2 x y" a cubic
// Bézier. Drawn for this project in a plain sign-writer's roman: design units with
// the cap height 100, the baseline at y = 0 and y up. Every stroke of a letter
// overlaps another stroke of it, so each letter is one piece of ink — apart from the
// dots of i, j, ! and ?, and the separate marks of the punctuation, which Stemline's
// sheet segmentation groups with their letter or keeps as letters of their own.

/** One character's skeleton: its width in design units and its pen strokes. */
export interface LetterSkeleton {
  /** Width of the skeleton's box from x = 0, in design units (ink overhangs it by half a nib). */
  readonly width: number;
  readonly strokes: readonly string[];
}

/** The cap height in design units: the scale every coordinate below is drawn to. */
export const DESIGN_CAP_HEIGHT = 100;

/** A dot: a short pen movement across the nib's edge (down and to the right), which a broad nib turns into a small slanted block. */
const dotAt = (x: number, y: number): string => `M ${x - 2} ${y + 3} L ${x + 2} ${y - 3}`;

export const LETTER_SKELETONS: Readonly<Record<string, LetterSkeleton>> = {
  A: { width: 80, strokes: ['M 0 0 L 40 100', 'M 40 100 L 80 0', 'M 18 32 L 62 32'] },
  B: { width: 62, strokes: ['M 6 0 L 6 100', 'M 6 100 L 34 100 C 56 100 58 54 32 54 L 6 54', 'M 6 54 L 36 54 C 64 54 64 0 34 0 L 6 0'] },
  C: { width: 72, strokes: ['M 68 84 C 56 102 6 104 4 50 C 4 -4 56 -2 70 16'] },
  D: { width: 78, strokes: ['M 6 0 L 6 100', 'M 6 100 L 32 100 C 86 100 86 0 32 0 L 6 0'] },
  E: { width: 58, strokes: ['M 6 0 L 6 100', 'M 6 100 L 54 100', 'M 6 52 L 44 52', 'M 6 0 L 56 0'] },
  F: { width: 54, strokes: ['M 6 0 L 6 100', 'M 6 100 L 54 100', 'M 6 52 L 44 52'] },
  G: { width: 76, strokes: ['M 70 82 C 58 102 6 104 4 50 C 4 -4 60 -4 72 14 L 72 44', 'M 46 44 L 74 44'] },
  H: { width: 76, strokes: ['M 6 0 L 6 100', 'M 70 0 L 70 100', 'M 6 52 L 70 52'] },
  I: { width: 14, strokes: ['M 7 0 L 7 100'] },
  J: { width: 44, strokes: ['M 38 100 L 38 22 C 38 -6 8 -8 0 12'] },
  K: { width: 70, strokes: ['M 6 0 L 6 100', 'M 66 100 L 6 38', 'M 28 60 L 70 0'] },
  L: { width: 56, strokes: ['M 6 100 L 6 0 L 54 0'] },
  M: { width: 94, strokes: ['M 4 0 L 10 100 L 47 18 L 84 100 L 90 0'] },
  N: { width: 78, strokes: ['M 6 0 L 6 100 L 72 0 L 72 100'] },
  O: { width: 86, strokes: ['M 43 100 C 92 100 92 0 43 0 C -6 0 -6 100 43 100'] },
  P: { width: 62, strokes: ['M 6 0 L 6 100', 'M 6 100 L 34 100 C 66 100 66 46 34 46 L 6 46'] },
  Q: { width: 86, strokes: ['M 43 100 C 92 100 92 0 43 0 C -6 0 -6 100 43 100', 'M 46 10 L 84 -18'] },
  R: { width: 68, strokes: ['M 6 0 L 6 100', 'M 6 100 L 34 100 C 64 100 64 50 34 50 L 6 50', 'M 30 50 L 68 0'] },
  S: { width: 60, strokes: ['M 54 86 C 44 104 4 102 6 76 C 8 52 56 56 56 24 C 56 -4 12 -4 2 14'] },
  T: { width: 72, strokes: ['M 36 0 L 36 100', 'M 2 100 L 70 100'] },
  U: { width: 76, strokes: ['M 6 100 L 6 32 C 6 -10 70 -10 70 32 L 70 100'] },
  V: { width: 78, strokes: ['M 0 100 L 39 0 L 78 100'] },
  W: { width: 108, strokes: ['M 0 100 L 26 0 L 54 86 L 82 0 L 108 100'] },
  X: { width: 74, strokes: ['M 2 100 L 72 0', 'M 70 100 L 4 0'] },
  Y: { width: 74, strokes: ['M 2 100 L 37 50 L 72 100', 'M 37 50 L 37 0'] },
  Z: { width: 66, strokes: ['M 4 100 L 62 100 L 4 0 L 64 0'] },

  a: { width: 54, strokes: ['M 8 56 C 18 70 46 70 46 46 L 46 0', 'M 46 36 C 30 38 4 34 4 16 C 4 -2 34 -4 46 14'] },
  b: { width: 58, strokes: ['M 6 106 L 6 0', 'M 6 42 C 14 70 56 72 56 34 C 56 -6 14 -6 6 16'] },
  c: { width: 50, strokes: ['M 48 54 C 38 72 2 70 2 34 C 2 -4 38 -4 50 12'] },
  d: { width: 58, strokes: ['M 52 106 L 52 0', 'M 52 44 C 44 70 2 70 2 32 C 2 -6 42 -4 52 18'] },
  e: { width: 54, strokes: ['M 4 34 L 50 34 C 50 72 2 74 2 32 C 2 -4 38 -4 52 12'] },
  f: { width: 40, strokes: ['M 40 98 C 32 108 14 108 14 86 L 14 0', 'M 0 64 L 36 64'] },
  g: { width: 56, strokes: ['M 50 66 L 50 -8 C 50 -36 12 -36 4 -22', 'M 50 40 C 42 70 2 70 2 34 C 2 2 40 0 50 22'] },
  h: { width: 58, strokes: ['M 6 106 L 6 0', 'M 6 40 C 16 70 52 72 52 44 L 52 0'] },
  i: { width: 14, strokes: ['M 7 66 L 7 0', dotAt(7, 90)] },
  j: { width: 30, strokes: ['M 22 66 L 22 -14 C 22 -34 6 -36 -2 -26', dotAt(22, 90)] },
  k: { width: 54, strokes: ['M 6 106 L 6 0', 'M 48 66 L 6 24', 'M 22 40 L 52 0'] },
  l: { width: 14, strokes: ['M 7 106 L 7 0'] },
  m: { width: 88, strokes: ['M 6 66 L 6 0', 'M 6 42 C 14 70 44 72 44 46 L 44 0', 'M 44 44 C 52 70 82 72 82 46 L 82 0'] },
  n: { width: 58, strokes: ['M 6 66 L 6 0', 'M 6 42 C 14 70 52 72 52 46 L 52 0'] },
  o: { width: 58, strokes: ['M 29 66 C 62 66 62 0 29 0 C -4 0 -4 66 29 66'] },
  p: { width: 58, strokes: ['M 6 66 L 6 -32', 'M 6 42 C 14 70 56 72 56 34 C 56 -6 14 -6 6 16'] },
  q: { width: 58, strokes: ['M 52 66 L 52 -32', 'M 52 44 C 44 70 2 70 2 32 C 2 -6 42 -4 52 18'] },
  r: { width: 42, strokes: ['M 6 66 L 6 0', 'M 6 42 C 14 66 32 70 42 60'] },
  s: { width: 46, strokes: ['M 42 56 C 34 72 4 70 4 52 C 4 34 44 38 44 16 C 44 -4 8 -4 0 10'] },
  t: { width: 40, strokes: ['M 14 90 L 14 12 C 14 -2 30 -4 40 6', 'M 0 64 L 36 64'] },
  u: { width: 58, strokes: ['M 6 66 L 6 22 C 6 -4 44 -4 52 24', 'M 52 66 L 52 0'] },
  v: { width: 58, strokes: ['M 0 66 L 29 0 L 58 66'] },
  w: { width: 86, strokes: ['M 0 66 L 21 0 L 43 56 L 65 0 L 86 66'] },
  x: { width: 56, strokes: ['M 2 66 L 54 0', 'M 54 66 L 2 0'] },
  y: { width: 58, strokes: ['M 0 66 L 29 0', 'M 58 66 L 22 -18 C 16 -30 8 -34 -2 -30'] },
  z: { width: 52, strokes: ['M 4 66 L 48 66 L 4 0 L 50 0'] },

  '0': { width: 60, strokes: ['M 30 96 C 62 96 62 0 30 0 C -2 0 -2 96 30 96'] },
  '1': { width: 34, strokes: ['M 6 78 L 26 96 L 26 0'] },
  '2': { width: 56, strokes: ['M 4 78 C 10 102 52 100 50 70 C 48 46 10 30 2 0 L 54 0'] },
  '3': { width: 56, strokes: ['M 4 84 C 14 102 50 100 48 74 C 46 54 22 52 18 52', 'M 18 52 C 58 52 58 0 26 0 C 12 0 4 6 0 14'] },
  '4': { width: 62, strokes: ['M 44 0 L 44 96 L 2 28 L 62 28'] },
  '5': { width: 56, strokes: ['M 50 96 L 12 96 L 8 56 C 26 66 54 62 54 32 C 54 -6 10 -4 2 12'] },
  '6': { width: 58, strokes: ['M 48 92 C 20 96 4 70 4 36 C 4 -4 54 -4 54 30 C 54 62 12 62 4 36'] },
  '7': { width: 56, strokes: ['M 2 96 L 56 96 L 18 0'] },
  '8': { width: 56, strokes: ['M 28 96 C 54 96 54 52 28 52 C 56 52 56 0 28 0 C 0 0 0 52 28 52 C 2 52 2 96 28 96'] },
  '9': { width: 58, strokes: ['M 54 60 C 46 36 4 36 4 64 C 4 98 54 98 54 60 C 54 22 38 2 10 4'] },

  '&': { width: 76, strokes: ['M 74 0 L 20 68 C 8 84 16 100 30 100 C 44 100 52 86 38 70 L 12 42 C -6 22 8 0 30 0 C 50 0 62 18 68 40'] },
  '!': { width: 16, strokes: ['M 8 100 L 8 30', dotAt(8, 4)] },
  '?': { width: 50, strokes: ['M 4 84 C 12 104 48 102 48 76 C 48 54 24 50 24 30', dotAt(24, 4)] },
  '.': { width: 16, strokes: [dotAt(8, 4)] },
  ',': { width: 18, strokes: ['M 7 5 L 11 9 C 13 -4 8 -14 2 -20'] },
  ':': { width: 16, strokes: [dotAt(8, 4), dotAt(8, 50)] },
  '-': { width: 36, strokes: ['M 2 36 L 34 36'] },
  "'": { width: 14, strokes: ['M 8 100 L 6 78'] },
};
