// How large an argument would be as JSON, estimated from above without building the
// JSON: the intents that carry a project or a font refuse a huge argument before
// validating it, so a runaway page cannot make the host spend long on it.

/** Characters a number, boolean or null may take in JSON, at most (a double's longest spelling, about 24). */
const SCALAR_JSON_CHARACTERS = 24;

/**
 * Whether `raw` would take more than `limit` characters as JSON, estimated from above
 * by walking it (strings by length, every value, key and separator counted) and
 * stopping as soon as the limit is passed, so a huge argument costs little to refuse.
 * Shared or cyclic parts (possible through structured clone) count once per visit
 * of the object holding them, and a cycle is walked once.
 */
export function exceedsJsonSize(raw: unknown, limit: number): boolean {
  let total = 0;
  const seen = new Set<object>();
  const pending: unknown[] = [raw];
  while (pending.length > 0) {
    const value = pending.pop();
    if (typeof value === 'string') total += value.length + 2;
    else if (typeof value !== 'object' || value === null) total += SCALAR_JSON_CHARACTERS;
    else if (seen.has(value)) total += SCALAR_JSON_CHARACTERS;
    else {
      seen.add(value);
      if (Array.isArray(value)) {
        total += value.length + 2;
        for (const item of value) pending.push(item);
      } else {
        for (const [key, item] of Object.entries(value)) {
          total += key.length + 4;
          pending.push(item);
        }
      }
    }
    if (total > limit) return true;
  }
  return false;
}
