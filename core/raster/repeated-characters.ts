/**
 * Characters assigned to more than one letter of a sheet. A font has one glyph per
 * character, so a character typed on two boxes (a slip while typing the row, or an
 * alternate drawn twice) cannot become a font until one box is retyped or the two
 * are merged into one letter; the sheet shows these before the letters are fitted.
 */
import type { SheetLetter } from './segment-sheet.ts';

export interface RepeatedCharacter {
  readonly character: string;
  /** The letters it is assigned to, by reading-order index, in reading order (two or more). */
  readonly letters: readonly number[];
}

/** Every character assigned to two or more of `letters`, in the reading order of its first letter. */
export function repeatedCharacters(letters: readonly Pick<SheetLetter, 'index' | 'character'>[]): RepeatedCharacter[] {
  const byCharacter = new Map<string, number[]>();
  for (const letter of [...letters].sort((a, b) => a.index - b.index)) {
    if (letter.character === null) continue;
    const holders = byCharacter.get(letter.character);
    if (holders) holders.push(letter.index);
    else byCharacter.set(letter.character, [letter.index]);
  }
  return [...byCharacter].filter(([, holders]) => holders.length > 1).map(([character, holders]) => ({ character, letters: holders }));
}

/** "3 and 27", "3, 9 and 27": letters by their number on the sheet (reading-order index + 1). */
export function letterNumbers(letters: readonly number[]): string {
  const numbers = letters.map((index) => String(index + 1));
  return numbers.length <= 1 ? numbers.join('') : `${numbers.slice(0, -1).join(', ')} and ${numbers[numbers.length - 1]}`;
}
