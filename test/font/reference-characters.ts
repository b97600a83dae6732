// The letters every reference-font check covers: A–Z, a–z, 0–9 and a spread of
// accented and special Latin letters and punctuation.
export const REFERENCE_CHARACTERS: readonly string[] = [
  ...'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789',
  ...'éèêëàâäåçñöøüßÅÉÖÜłŁœ&?!',
];
