// Fuzzing the host's handlers with what a page could send through the preload
// bridge or the browser host: every intent of the contract with arguments of any
// shape, and with valid arguments (a project, a font, a file name, a handle) in
// which one value is replaced, removed or made huge. Every call either answers or
// is refused with a HandlerError whose message a person can read; nothing outside
// the workspace and the host's own folders is ever read or written.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { INTENT_NAMES } from '../../electron/api-contract.ts';
import { HandlerError } from '../../electron/handler-error.ts';
import { browserHostFixture, sampleProject, SECRET_TEXT } from '../electron/project-host-fixture.ts';
import { editedJson, type Json } from './json-edits.ts';
import { expectTypedError, fuzzParameters, fuzzSettings, suiteTimeLimitMs, withinLimitsAsync } from './fuzz-settings.ts';

const settings = fuzzSettings('handler arguments');

/** Longest message a refusal may have: it never echoes a huge argument back. */
const MAX_MESSAGE_CHARACTERS = 1000;

/** File names a page might try: ordinary, hidden, escaping the workspace, absolute, empty, over-long, with odd characters. */
const FILE_NAMES = ['harbour.stemline', '.hidden.stemline', '../outside/secret.stemline', '/etc/passwd', '', 'a'.repeat(300), 'con', 'nul.stemline', 'x/y.stemline', 'naïve ✓.stemline', 'trail. ', 'font.otf'];

describe('fuzzing the host handlers', () => {
  it(`every intent answers or refuses any argument with a readable HandlerError, touching nothing outside its folders (${settings.runs} cases)`, async () => {
    const host = browserHostFixture();
    const project = sampleProject() as unknown as Json;
    const { font, glyphs } = sampleProject();
    const valid: Json[] = [
      {},
      { name: 'harbour.stemline' },
      { handle: '0123456789abcdef0123456789abcdef' },
      { project },
      { project, name: 'harbour.stemline' },
      { font, glyphs } as unknown as Json,
      { font, glyphs, name: 'Harbour.otf' } as unknown as Json,
      { title: 'harbour', hasProject: true, hasUnsavedChanges: false, canUndo: false, canRedo: true },
    ];
    const args = fc.oneof(
      { weight: 4, arbitrary: editedJson(valid) },
      { weight: 2, arbitrary: fc.record({ name: fc.constantFrom(...FILE_NAMES) }, { requiredKeys: [] }).chain((named) => fc.constantFrom<Json>({ ...named, project }, named, { ...named, font, glyphs } as unknown as Json)) },
      { weight: 2, arbitrary: fc.anything({ maxDepth: 3 }) },
    );
    let answered = 0;
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...INTENT_NAMES, 'deleteEverything', '__proto__'), args, async (intent, raw) => {
        await withinLimitsAsync(`the ${intent} handler`, async () => {
          try {
            await host.call(intent as never, raw);
            answered++;
          } catch (error) {
            expectTypedError(`the ${intent} handler`, error, [HandlerError]);
            expect((error as HandlerError).message.length).toBeLessThan(MAX_MESSAGE_CHARACTERS);
          }
        });
      }),
      fuzzParameters(settings),
    );
    console.info(`handler arguments: ${answered} of ${settings.runs} calls answered`);
    expect(answered).toBeGreaterThan(0);
    expect(readFileSync(host.secret, 'utf8')).toBe(SECRET_TEXT);
    expect(readdirSync(host.outside)).toEqual(['secret.stemline']);
    // Only the workspace, the host's recovery folder and its recent-projects file are written.
    expect(readdirSync(host.root).sort()).toEqual(['app-data', 'outside', 'workspace']);
    for (const name of readdirSync(host.workspace)) expect(name, join(host.workspace, name)).toMatch(/\.(stemline|otf)$|^\..*\.recovery$/);
  }, suiteTimeLimitMs(settings.runs, 50));
});
