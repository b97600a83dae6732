// Characters typed on more than one box of a sheet: found in reading order, with every
// box that holds them, so the sheet can mark them before the letters are fitted.
import { describe, expect, it } from 'vitest';
import { letterNumbers, repeatedCharacters } from '../../core/raster/index.ts';

const letters = (characters: (string | null)[]) => characters.map((character, index) => ({ index, character }));

describe('characters assigned to more than one letter', () => {
  it('are found with every letter holding them, in reading order, unassigned letters aside', () => {
    expect(repeatedCharacters(letters(['a', 'b', null, 'a', 'c', null, 'b', 'a']))).toEqual([
      { character: 'a', letters: [0, 3, 7] },
      { character: 'b', letters: [1, 6] },
    ]);
  });

  it('are none when every character is typed once, or nothing is assigned', () => {
    expect(repeatedCharacters(letters(['A', 'a', 'B', 'b']))).toEqual([]);
    expect(repeatedCharacters(letters([null, null]))).toEqual([]);
  });

  it('are named by the letters’ numbers on the sheet (reading order, from 1)', () => {
    expect(letterNumbers([2])).toBe('3');
    expect(letterNumbers([2, 26])).toBe('3 and 27');
    expect(letterNumbers([0, 8, 26])).toBe('1, 9 and 27');
  });
});
