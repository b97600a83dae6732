// `npm start`: builds the renderer, then opens Stemline in its Electron window, or,
// where no Electron binary is installed, says so in one line and serves the same
// renderer and handlers in the browser on 127.0.0.1, keeping projects in a workspace
// folder: the one named on the command line (`npm start -- ~/lettering`), or else the
// directory `npm start` was run from. The address printed carries the run's key
// (browser-access.ts): only a browser given that address is answered.
import { spawn, spawnSync } from 'node:child_process';
import { join, resolve } from 'node:path';
import { build } from 'vite';
import { locateElectron } from './locate-electron.ts';
import { startBrowserHost } from './browser-host.ts';
import { PROJECT_ROOT, RENDERER_BUILD_DIR } from './project-paths.ts';

/** Browser-mode port unless STEMLINE_PORT says otherwise; a free one is taken if busy. */
const DEFAULT_BROWSER_PORT = 5731;

/**
 * The browser-mode workspace: the folder named on the command line, relative to where
 * `npm start` was typed, or that directory itself. npm runs scripts in the package's
 * folder and records the caller's directory in INIT_CWD.
 */
function workspaceFolder(): string {
  const from = process.env.INIT_CWD ?? process.cwd();
  const named = process.argv[2];
  return named === undefined ? from : resolve(from, named);
}

async function main(): Promise<void> {
  await build({ configFile: join(PROJECT_ROOT, 'renderer', 'vite.config.ts'), logLevel: 'warn' });
  const electron = locateElectron();
  if (electron.found) {
    compileElectronShell();
    const child = spawn(electron.binary, [PROJECT_ROOT], { stdio: 'inherit' });
    child.on('exit', (code) => process.exit(code ?? 0));
    return;
  }
  console.log(`Electron is not available here (${electron.reason}); serving Stemline in the browser instead.`);
  const workspace = workspaceFolder();
  const host = await startOnFreePort(Number(process.env.STEMLINE_PORT ?? DEFAULT_BROWSER_PORT), workspace);
  console.log(`Stemline is running at ${host.url}  (open this address, key included, in Chromium, Firefox or another browser on this computer; Ctrl+C stops it)`);
  console.log(`Projects are opened from and saved to ${workspace}`);
}

function compileElectronShell(): void {
  const tsc = join(PROJECT_ROOT, 'node_modules', '.bin', 'tsc');
  const result = spawnSync(tsc, ['-p', join(PROJECT_ROOT, 'electron', 'tsconfig.json')], { stdio: 'inherit' });
  if (result.status !== 0) throw new Error('Building the Electron shell failed (see the messages above).');
}

async function startOnFreePort(port: number, workspace: string) {
  try {
    return await startBrowserHost(RENDERER_BUILD_DIR, port, { workspace });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
    return startBrowserHost(RENDERER_BUILD_DIR, 0, { workspace });
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
});
