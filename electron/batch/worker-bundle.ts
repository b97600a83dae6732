// The batch worker as one JavaScript file, for running from the TypeScript sources
// (`npm run stemline`, the tests, the benchmarks): a worker thread that loads the
// sources through tsx transpiles and links some ninety modules again, about 0.6 s,
// where one bundled file starts in about 0.2 s (measured by `npm run bench -- jobs`).
// The bundle is made by esbuild — the transpiler tsx itself runs on, found beside it —
// and kept in a cache folder with a manifest of every source file it was made from and
// a hash of each file's content as esbuild read it. It is used again only while every
// one of those files still has that content and the bundle file its own recorded
// hash, so an edited source is never run from an old bundle. Packages stay outside the
// bundle (imported from node_modules as usual). Files are written under a temporary
// name and renamed, so builds running at once never read half a file.
import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';
import { mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';

/**
 * Changes whenever the bundling settings below change, so bundles made with the old
 * ones are not taken for current.
 */
const BUNDLE_SETTINGS_VERSION = 1;
/** The oldest Node the project supports (package.json engines). */
const NODE_TARGET = 'node20';
/** Characters of a hex digest kept in file names: 64 bits, plenty to tell a few bundles apart. */
const NAME_DIGEST_LENGTH = 16;

/** What bundling needs to know. */
export interface WorkerBundleSettings {
  /** The folder bundles and manifests are kept in (created when missing). */
  readonly cacheFolder: string;
  /** A file from which `esbuild` is resolved (a package that depends on it, e.g. tsx's package.json). */
  readonly esbuildFrom: string;
}

/** The record of one bundle: its file, its hash and the sources it was made from. */
interface BundleManifest {
  readonly bundle: string;
  readonly bundleSha256: string;
  /** Absolute path → SHA-256 of the content esbuild was given. */
  readonly inputs: Readonly<Record<string, string>>;
}

/** Minimal view of the esbuild API used here. */
interface Esbuild {
  readonly version: string;
  build(options: Record<string, unknown>): Promise<{ outputFiles: Array<{ contents: Uint8Array }> }>;
}

/**
 * The path of a bundle of `entry` (a TypeScript module) made from the sources as they
 * are now: the cached one when none of its sources changed, else a new one. Throws when
 * esbuild cannot be found or cannot bundle the sources.
 */
export async function workerBundle(entry: string, settings: WorkerBundleSettings): Promise<string> {
  const esbuild = loadEsbuild(settings.esbuildFrom);
  const key = sha256(JSON.stringify([resolve(entry), esbuild.version, process.version, BUNDLE_SETTINGS_VERSION])).slice(0, NAME_DIGEST_LENGTH);
  const manifestPath = join(settings.cacheFolder, `${basename(entry).replace(/\.[^.]+$/, '')}-${key}.json`);
  const cached = readManifest(manifestPath);
  if (cached && isCurrent(cached, settings.cacheFolder)) return join(settings.cacheFolder, cached.bundle);

  const inputs: Record<string, string> = {};
  const result = await esbuild.build({
    entryPoints: [resolve(entry)],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: NODE_TARGET,
    packages: 'external',
    write: false,
    logLevel: 'silent',
    plugins: [recordInputs(inputs)],
  });
  const contents = result.outputFiles[0]?.contents;
  if (!contents) throw new Error(`esbuild made no bundle of ${entry}.`);
  const bundleSha256 = sha256(contents);
  const bundle = `${basename(manifestPath, '.json')}-${bundleSha256.slice(0, NAME_DIGEST_LENGTH)}.mjs`;
  mkdirSync(settings.cacheFolder, { recursive: true });
  writeAtomically(join(settings.cacheFolder, bundle), contents);
  writeAtomically(manifestPath, `${JSON.stringify({ bundle, bundleSha256, inputs } satisfies BundleManifest, null, 1)}\n`);
  if (cached && cached.bundle !== bundle) rmSync(join(settings.cacheFolder, cached.bundle), { force: true });
  return join(settings.cacheFolder, bundle);
}

/** True when the bundle file and every source it was made from are as recorded. */
function isCurrent(manifest: BundleManifest, folder: string): boolean {
  if (contentHash(join(folder, manifest.bundle)) !== manifest.bundleSha256) return false;
  return Object.entries(manifest.inputs).every(([path, hash]) => contentHash(path) === hash);
}

/** An esbuild plugin that loads each source file itself, so the hash recorded is of exactly what was bundled. */
function recordInputs(inputs: Record<string, string>) {
  return {
    name: 'record-inputs',
    setup(build: { onLoad(filter: { filter: RegExp }, load: (args: { path: string }) => { contents: Buffer; loader: string }): void }) {
      build.onLoad({ filter: /\.[cm]?[jt]sx?$/ }, (args) => {
        const contents = readFileSync(args.path);
        inputs[args.path] = sha256(contents);
        const extension = /\.([cm]?)([jt]sx?)$/.exec(args.path)?.[2] ?? 'js';
        return { contents, loader: extension };
      });
    },
  };
}

function loadEsbuild(from: string): Esbuild {
  const require = createRequire(from);
  return require(require.resolve('esbuild')) as Esbuild;
}

function readManifest(path: string): BundleManifest | null {
  try {
    const parsed = JSON.parse(readFileSync(path, 'utf8')) as Partial<BundleManifest>;
    if (typeof parsed.bundle !== 'string' || typeof parsed.bundleSha256 !== 'string' || typeof parsed.inputs !== 'object' || parsed.inputs === null) return null;
    return parsed as BundleManifest;
  } catch {
    return null;
  }
}

/** The SHA-256 of a file's content, or null when it cannot be read. */
function contentHash(path: string): string | null {
  try {
    return sha256(readFileSync(path));
  } catch {
    return null;
  }
}

function sha256(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

function writeAtomically(path: string, data: string | Uint8Array): void {
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now()}.tmp`);
  writeFileSync(temporary, data);
  renameSync(temporary, path);
}
