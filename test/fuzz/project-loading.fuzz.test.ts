// Fuzzing project loading: projects written by Stemline's own save (empty, with
// letters, with an embedded scan), mutated as bytes (a half-synced or hand-edited
// file), as JSON (a field replaced by any JSON value, deleted, or wrapped deep in
// arrays), and JSON made up from nothing. Every case either loads to a project the
// schema accepts, which saves and loads again to the same project, or is refused
// with a ProjectError whose message names the file: never another exception, a
// hang or a runaway allocation.
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseProject, serializeProject } from '../../electron/io/project/project-file.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import { mutatedSample } from './byte-mutation.ts';
import { edited, pathsOf, type Json } from './json-edits.ts';
import { projectSamples, scanSamples, type Sample } from './fuzz-samples.ts';
import { expectTypedError, fuzzParameters, fuzzSettings, suiteTimeLimitMs, withinLimits } from './fuzz-settings.ts';

const settings = fuzzSettings('project loading');

/** Deepest nesting a made-up value is wrapped in: far past any real project's (about 6 levels), to find recursion without a bound. */
const MAX_WRAP_DEPTH = 5000;

/** A marker put where the deep value goes, replaced in the text: JSON.stringify itself overflows its stack on thousands of levels. */
const DEEP_MARKER = '\u0000deep\u0000';

/** JSON text of `root` with the marker replaced by `inner` inside `depth` arrays. */
function withDeepValue(text: string, inner: Json, depth: number): string {
  return text.replace(JSON.stringify(DEEP_MARKER), `${'['.repeat(depth)}${JSON.stringify(inner)}${']'.repeat(depth)}`);
}

describe('fuzzing project loading', () => {
  let samples: Sample[] = [];
  beforeAll(async () => {
    const scans = await scanSamples();
    samples = await projectSamples(scans[0]!);
  });

  it(`every mutated or made-up project loads and saves again, or is refused with a ProjectError naming the file (${settings.runs} cases)`, async () => {
    const parsed = samples.map((s) => ({ name: s.name, json: JSON.parse(new TextDecoder().decode(s.bytes)) as Json }));
    const jsonEdit = fc
      .record({ sample: fc.constantFrom(...parsed), pick: fc.nat(), replacement: fc.oneof(fc.jsonValue({ maxDepth: 3 }), fc.constant(undefined)), depth: fc.oneof(fc.constant(0), fc.integer({ min: 1, max: MAX_WRAP_DEPTH })) })
      .map(({ sample, pick, replacement, depth }) => {
        const paths = pathsOf(sample.json);
        const path = paths[pick % paths.length]!;
        const changed = edited(sample.json, path, replacement === undefined ? undefined : depth === 0 ? (replacement as Json) : DEEP_MARKER);
        return { name: sample.name, text: changed === undefined ? '' : withDeepValue(JSON.stringify(changed), replacement as Json, depth) };
      });
    const bytesEdit = mutatedSample(samples).map(({ name, bytes }) => ({ name, text: new TextDecoder().decode(bytes) }));
    const madeUp = fc.jsonValue({ maxDepth: 4 }).map((value) => ({ name: 'made-up.stemline', text: JSON.stringify(value) }));
    const input = fc.oneof({ weight: 5, arbitrary: jsonEdit }, { weight: 4, arbitrary: bytesEdit }, { weight: 1, arbitrary: madeUp });
    let loaded = 0;
    const folder = mkdtempSync(join(tmpdir(), 'stemline-fuzz-load-'));
    expect(folder).not.toBe('');
    await fc.assert(
      fc.asyncProperty(input, async ({ name, text }) => {
        withinLimits(`loading a mutated ${name}`, () => {
          let project;
          try {
            project = parseProject(text, name);
          } catch (error) {
            expectTypedError(`loading a mutated ${name}`, error, [ProjectError]);
            expect((error as ProjectError).message).toContain(name);
            expect((error as ProjectError).message.length, (error as ProjectError).message.slice(0, 300)).toBeLessThan(2000); // never the whole file echoed back
            return;
          }
          loaded++;
          // What loads saves and loads again to the same project (the save writes only what the schema holds).
          const again = parseProject(serializeProject(project), name);
          expect({ ...again, savedBy: undefined }).toEqual({ ...project, savedBy: undefined });
        });
      }),
      fuzzParameters(settings),
    );
    console.info(`project loading: ${loaded} of ${settings.runs} cases loaded`);
    expect(loaded).toBeGreaterThan(0);
  }, suiteTimeLimitMs(settings.runs, 50));
});
