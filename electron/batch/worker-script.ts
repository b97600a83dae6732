// Where the batch worker's code is and how to start it. In the compiled build
// (electron/tsconfig.json rewrites `.ts` imports to `.js`) it is `batch-worker.js`
// beside this module, started as it is. From the sources (tsx, Vitest) it is
// `batch-worker.ts` bundled into one JavaScript file (worker-bundle.ts), kept in
// node_modules/.cache beside the installed packages so its package imports resolve as
// the sources' do. Where that cannot be made (no esbuild beside tsx, a read-only
// node_modules), the worker is started by a two-line bootstrap that imports the
// sources through tsx's own API (`tsImport`) — the same code, only slower to start:
// a worker thread does not get tsx's loader from its parent on Node 20 (tsx registers
// its hooks on the main thread only).
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { workerBundle } from './worker-bundle.ts';

/** How to start a batch worker: a file to run, or (from the sources, without a bundle) bootstrap code to evaluate. */
export type WorkerScript = { readonly url: URL; readonly eval?: undefined } | { readonly eval: string; readonly url: URL };

/** The file name of the worker without its extension. */
const WORKER_NAME = 'batch-worker';
/** The bundles' folder inside node_modules (`.cache` is where tools keep such files, common practice). */
const BUNDLE_FOLDER = join('.cache', 'stemline-batch-worker');

/**
 * The worker script for a module at `moduleUrl` (this module's own URL by default):
 * the compiled file, or from the sources their bundle, or failing that the tsx bootstrap.
 */
export async function batchWorkerScript(moduleUrl: string = import.meta.url, bundle: typeof workerBundle = workerBundle): Promise<WorkerScript> {
  const script = unbundledWorkerScript(moduleUrl);
  if (script.eval === undefined) return script;
  try {
    const tsxPackage = tsxPackageJson(moduleUrl);
    const path = await bundle(fileURLToPath(script.url), { cacheFolder: join(dirname(dirname(tsxPackage)), BUNDLE_FOLDER), esbuildFrom: tsxPackage });
    return { url: pathToFileURL(path) };
  } catch {
    return script;
  }
}

/** The worker script without a bundle: the compiled file beside a `.js` module, the tsx bootstrap beside a `.ts` one. */
export function unbundledWorkerScript(moduleUrl: string): WorkerScript {
  const fromSources = new URL(moduleUrl).pathname.endsWith('.ts');
  const url = new URL(`./${WORKER_NAME}${fromSources ? '.ts' : '.js'}`, moduleUrl);
  if (!fromSources) return { url };
  const api = tsxApiUrl(moduleUrl);
  return { url, eval: `import(${JSON.stringify(api)}).then(({ tsImport }) => tsImport(${JSON.stringify(url.href)}, ${JSON.stringify(moduleUrl)}));` };
}

function tsxPackageJson(moduleUrl: string): string {
  return createRequire(moduleUrl).resolve('tsx/package.json');
}

/** The URL of tsx's ESM API, from its package.json's exports map (`tsx/esm/api`, import condition). */
function tsxApiUrl(moduleUrl: string): string {
  const packageJson = tsxPackageJson(moduleUrl);
  const manifest = JSON.parse(readFileSync(packageJson, 'utf8')) as { exports?: Record<string, unknown> };
  const entry = manifest.exports?.['./esm/api'] as { import?: { default?: string } } | undefined;
  const relative = entry?.import?.default;
  if (relative === undefined) throw new Error('The installed tsx has no "tsx/esm/api" export, which the batch worker needs to run from the TypeScript sources. Reinstall the dependencies (npm ci).');
  return pathToFileURL(join(dirname(packageJson), relative)).href;
}
