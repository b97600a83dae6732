// Where the batch worker's code is and how to start it. The worker file sits beside
// this module: `batch-worker.js` in the compiled build (electron/tsconfig.json
// rewrites `.ts` imports to `.js`), started as it is; `batch-worker.ts` when running
// from the sources (tsx, Vitest). A worker thread does not get tsx's loader from its
// parent on Node 20 (tsx registers its hooks on the main thread only), so from the
// sources the worker is started by a two-line bootstrap that imports it through
// tsx's own API (`tsImport`), found from this module.
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';

/** How to start a batch worker: a file to run, or (from the sources) bootstrap code to evaluate. */
export type WorkerScript = { readonly url: URL; readonly eval?: undefined } | { readonly eval: string; readonly url: URL };

/** The file name of the worker without its extension. */
const WORKER_NAME = 'batch-worker';

/** The worker script for a module at `moduleUrl` (this module's own URL by default). */
export function batchWorkerScript(moduleUrl: string = import.meta.url): WorkerScript {
  const fromSources = new URL(moduleUrl).pathname.endsWith('.ts');
  const url = new URL(`./${WORKER_NAME}${fromSources ? '.ts' : '.js'}`, moduleUrl);
  if (!fromSources) return { url };
  const api = tsxApiUrl(moduleUrl);
  return { url, eval: `import(${JSON.stringify(api)}).then(({ tsImport }) => tsImport(${JSON.stringify(url.href)}, ${JSON.stringify(moduleUrl)}));` };
}

/** The URL of tsx's ESM API, from its package.json's exports map (`tsx/esm/api`, import condition). */
function tsxApiUrl(moduleUrl: string): string {
  const packageJson = createRequire(moduleUrl).resolve('tsx/package.json');
  const manifest = JSON.parse(readFileSync(packageJson, 'utf8')) as { exports?: Record<string, unknown> };
  const entry = manifest.exports?.['./esm/api'] as { import?: { default?: string } } | undefined;
  const relative = entry?.import?.default;
  if (relative === undefined) throw new Error('The installed tsx has no "tsx/esm/api" export, which the batch worker needs to run from the TypeScript sources. Reinstall the dependencies (npm ci).');
  return pathToFileURL(join(dirname(packageJson), relative)).href;
}
