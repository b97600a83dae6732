// Edits of a JSON value for the fuzzing suites: one value anywhere inside it (found
// by its path of keys) replaced or removed, as a hand-edited project file or a
// page sending a damaged argument would have it.
import fc from 'fast-check';

export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** Every path to a value inside `value`, as key lists, the value itself first. */
export function pathsOf(value: Json, prefix: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  out.push(prefix);
  if (Array.isArray(value)) value.forEach((item, i) => pathsOf(item, [...prefix, i], out));
  else if (value !== null && typeof value === 'object') for (const [key, item] of Object.entries(value)) pathsOf(item, [...prefix, key], out);
  return out;
}

/** `root` with the value at `path` replaced by `replacement`, or removed when it is undefined. `root` is not changed. */
export function edited(root: Json, path: readonly (string | number)[], replacement: Json | undefined): Json | undefined {
  if (path.length === 0) return replacement;
  const [head, ...rest] = path;
  const copy: Json = Array.isArray(root) ? [...root] : { ...(root as Record<string, Json>) };
  const next = edited((copy as Record<string | number, Json>)[head!]!, rest, replacement);
  if (next === undefined) {
    if (Array.isArray(copy)) copy.splice(head as number, 1);
    else delete (copy as Record<string, Json>)[head as string];
  } else (copy as Record<string | number, Json>)[head!] = next;
  return copy;
}

/** One of `values` with one value inside it replaced by any JSON value (or removed). */
export function editedJson(values: readonly Json[]): fc.Arbitrary<Json | undefined> {
  return fc.record({ value: fc.constantFrom(...values), pick: fc.nat(), replacement: fc.oneof(fc.jsonValue({ maxDepth: 3 }) as fc.Arbitrary<Json>, fc.constant(undefined)) }).map(({ value, pick, replacement }) => {
    const paths = pathsOf(value);
    return edited(value, paths[pick % paths.length]!, replacement);
  });
}
