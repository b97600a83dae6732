// The proof text split by what the font can set: runs of characters the font has,
// and runs of characters it does not, which the proof shows in the fallback type,
// marked, and lists by name — never silently replaced.

export interface ProofRun {
  readonly text: string;
  /** True for characters the font does not have. */
  readonly missing: boolean;
}

/** `text` as alternating runs of characters in `characters` and not in it (by code point). */
export function proofRuns(text: string, characters: ReadonlySet<string>): ProofRun[] {
  const runs: ProofRun[] = [];
  for (const character of text) {
    const missing = !characters.has(character);
    const last = runs[runs.length - 1];
    if (last !== undefined && last.missing === missing) runs[runs.length - 1] = { text: last.text + character, missing };
    else runs.push({ text: character, missing });
  }
  return runs;
}

/** The characters of `text` the font does not have, each once, in the order they first appear. */
export function missingCharacters(text: string, characters: ReadonlySet<string>): string[] {
  return [...new Set([...text].filter((c) => !characters.has(c)))];
}

/** How a character is named in the note: itself when it is visible, otherwise its code point ("U+00A0"). */
export function characterLabel(character: string): string {
  if (/^[\p{L}\p{N}\p{P}\p{S}]$/u.test(character)) return character;
  return `U+${(character.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;
}
