// What the proof sets: its first text uses only letters the font has (words where
// enough fit, otherwise each letter between control letters), and a text with
// characters the font lacks is split so those are marked and listed, each once —
// never silently set as if they were the user's letters.
import { describe, expect, it } from 'vitest';
import { sampleText } from '../../renderer/src/proof/sample-text.ts';
import { characterLabel, missingCharacters, proofRuns } from '../../renderer/src/proof/proof-runs.ts';

const set = (characters: string) => new Set([...characters, ' ']);

describe('the proof’s first text', () => {
  it('is words made only of the letters the font has', () => {
    const letters = set('abcdefghijklmnopqrstuvwxyzH');
    const text = sampleText(letters);
    expect(text.split(' ').length).toBeGreaterThanOrEqual(3);
    expect([...text].every((c) => letters.has(c))).toBe(true);
    expect(text).toMatch(/^Harbour signs hand/);
  });

  it('sets each letter between control letters when too few words fit', () => {
    expect(sampleText(set('lov'))).toBe('lov olo ovo');
    expect(sampleText(set('xz'))).toBe('xz xzx');
  });

  it('is empty when the font has no letters', () => {
    expect(sampleText(set(''))).toBe('');
  });
});

describe('characters the font lacks', () => {
  it('are split into runs of their own and listed once each, in order', () => {
    const font = set('lov');
    expect(proofRuns('love lol', font)).toEqual([
      { text: 'lov', missing: false },
      { text: 'e', missing: true },
      { text: ' lol', missing: false },
    ]);
    expect(missingCharacters('velvet ease', font)).toEqual(['e', 't', 'a', 's']);
    expect(missingCharacters('lol', font)).toEqual([]);
  });

  it('counts by code point, so a letter outside the BMP is one character', () => {
    expect(proofRuns('o𝒜o', set('o'))).toEqual([{ text: 'o', missing: false }, { text: '𝒜', missing: true }, { text: 'o', missing: false }]);
  });

  it('are named by their code point when they are invisible', () => {
    expect(characterLabel('é')).toBe('é');
    expect(characterLabel('\u00a0')).toBe('U+00A0');
    expect(characterLabel('\t')).toBe('U+0009');
  });
});
