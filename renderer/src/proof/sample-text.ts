// The text the proof starts with, before the user types their own: a few words that
// can be set entirely with the letters the project has, so the first look at the
// font shows it whole. Where too few words fit (an alphabet only begun), each letter
// is set between two of a steady "control" letter instead, which shows its spacing.

/** Words tried, in this order: plain English words of the lettering trade and of signs, chosen here to cover many letters. */
const CANDIDATE_WORDS = [
  'Harbour', 'signs', 'hand', 'lettering', 'ink', 'brush', 'quick', 'study', 'open', 'daily', 'fresh', 'coffee',
  'jazz', 'vinyl', 'wax', 'market', 'bakery', 'glove', 'pen', 'old', 'love', 'lion', 'moon', 'noon', 'loom',
  'wool', 'vol', 'lo', 'on', 'no', 'go', 'do', 'to', 'so', 'be', 'we', 'it', 'is', 'in', 'an', 'at', 'a', 'I',
  'HARBOUR', 'SIGNS', 'OPEN', 'LOVE', 'OLD', 'NO', 'ON',
];

/** Words in the sample, at most: enough for one line at the largest proof size. */
const MAX_SAMPLE_WORDS = 5;

/** Fewer fitting words than this and the sample sets each letter between control letters instead. */
const MIN_SAMPLE_WORDS = 3;

/** Control letters, in order of preference: round and straight lowercase, then capitals (common practice for spacing proofs). */
const CONTROL_LETTERS = ['n', 'o', 'H', 'O'];

function fits(word: string, letters: ReadonlySet<string>): boolean {
  return [...word].every((c) => letters.has(c));
}

/**
 * A sample text for `letters` (the characters the font has; the space is assumed):
 * up to MAX_SAMPLE_WORDS candidate words made only of those letters, or, when fewer
 * than MIN_SAMPLE_WORDS fit, the letters themselves followed by each letter between
 * two control letters. Empty when there are no letters.
 */
export function sampleText(letters: ReadonlySet<string>): string {
  const drawn = [...letters].filter((c) => c.trim() !== '');
  if (drawn.length === 0) return '';
  const words = CANDIDATE_WORDS.filter((w) => fits(w, letters)).slice(0, MAX_SAMPLE_WORDS);
  if (words.length >= MIN_SAMPLE_WORDS) return words.join(' ');
  const control = CONTROL_LETTERS.find((c) => letters.has(c)) ?? drawn[0]!;
  const framed = drawn.filter((c) => c !== control).map((c) => `${control}${c}${control}`);
  return [drawn.join(''), ...framed].join(' ');
}
