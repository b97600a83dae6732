/**
 * Which letters the vertical metrics are measured on. By common practice in type
 * design, heights are read from letters whose extremes are flat — round and pointed
 * letters (O, o, A, V, v…) overshoot the line they optically sit on, so they would
 * inflate the measure. Lists are ordered by how reliably flat each letter is.
 */

/** Capitals with flat tops (stems and bars reach the cap height exactly). */
export const CAP_HEIGHT_LETTERS = 'HIEFTLZKNMDBPR';

/** Lower-case letters with flat tops at the x-height (no bowl or arch at the top). */
export const X_HEIGHT_LETTERS = 'xzvwyu';

/** Lower-case letters whose ascending stems have flat tops. */
export const ASCENDER_LETTERS = 'lhkbd';

/** Lower-case letters whose descending stems have flat bottoms. */
export const DESCENDER_LETTERS = 'pq';

/**
 * Letters whose top carries a separate mark (the dot of i and j): measured on their
 * body only. Listed so callers know the letter box includes the dot.
 */
export const DOTTED_LETTERS = 'ij';
