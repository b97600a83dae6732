// The batch worker's bundle (run from the sources) is made again whenever any source
// it was made from changes, and used again only while none has: an edited source
// never runs from an old bundle. Checked on a small module tree of its own.
import { afterAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { workerBundle } from '../../electron/batch/worker-bundle.ts';

const folder = mkdtempSync(join(tmpdir(), 'stemline-bundle-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const settings = { cacheFolder: join(folder, 'cache'), esbuildFrom: createRequire(import.meta.url).resolve('tsx/package.json') };
const entry = join(folder, 'src', 'entry.ts');
const part = join(folder, 'src', 'lib', 'part.ts');
mkdirSync(join(folder, 'src', 'lib'), { recursive: true });
writeFileSync(entry, "import { word } from './lib/part.ts';\nconst greeting: string = `${word} from the bundle`;\nconsole.log(greeting);\n");

/** What running the bundle prints. */
function run(bundle: string): string {
  return spawnSync(process.execPath, [bundle], { encoding: 'utf8' }).stdout.trim();
}

describe('the worker bundle from the sources', () => {
  it('runs the sources as they are, is used again while they are unchanged, and is made again when any changes', async () => {
    writeFileSync(part, "export const word: string = 'first';\n");
    const first = await workerBundle(entry, settings);
    expect(run(first)).toBe('first from the bundle');
    const madeAt = statSync(first).mtimeMs;

    const again = await workerBundle(entry, settings);
    expect(again).toBe(first);
    expect(statSync(again).mtimeMs).toBe(madeAt);

    // An imported file, not the entry, changes.
    writeFileSync(part, "export const word: string = 'second';\n");
    const changed = await workerBundle(entry, settings);
    expect(changed).not.toBe(first);
    expect(run(changed)).toBe('second from the bundle');
  });

  it('records every source file it was made from', async () => {
    await workerBundle(entry, settings);
    const manifests = spawnSync('ls', [settings.cacheFolder], { encoding: 'utf8' }).stdout.split('\n').filter((name) => name.endsWith('.json'));
    expect(manifests).toHaveLength(1);
    const manifest = JSON.parse(readFileSync(join(settings.cacheFolder, manifests[0] as string), 'utf8')) as { inputs: Record<string, string> };
    expect(Object.keys(manifest.inputs).sort()).toEqual([part, entry].sort());
  });

  it('makes the bundle again when the bundle file itself was altered', async () => {
    writeFileSync(part, "export const word: string = 'third';\n");
    const bundle = await workerBundle(entry, settings);
    writeFileSync(bundle, "console.log('tampered');\n");
    const remade = await workerBundle(entry, settings);
    expect(run(remade)).toBe('third from the bundle');
  });

  it('fails in words when a source does not compile, rather than keeping an old bundle', async () => {
    writeFileSync(part, "export const word: string = ;\n");
    await expect(workerBundle(entry, settings)).rejects.toThrow();
    writeFileSync(part, "export const word: string = 'fourth';\n");
    expect(run(await workerBundle(entry, settings))).toBe('fourth from the bundle');
  });
});
