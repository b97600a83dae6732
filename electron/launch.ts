// `npm start`: builds the renderer, then opens Stemline in its Electron window, or,
// where no Electron binary is installed, says so in one line and serves the same
// renderer and handlers in the browser on 127.0.0.1.
import { spawn, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { build } from 'vite';
import { locateElectron } from './locate-electron.ts';
import { startBrowserHost } from './browser-host.ts';
import { PROJECT_ROOT, RENDERER_BUILD_DIR } from './project-paths.ts';

/** Browser-mode port unless STEMLINE_PORT says otherwise; a free one is taken if busy. */
const DEFAULT_BROWSER_PORT = 5731;

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
  const host = await startOnFreePort(Number(process.env.STEMLINE_PORT ?? DEFAULT_BROWSER_PORT));
  console.log(`Stemline is running at ${host.url}  (open it in Chromium, Firefox or another browser; Ctrl+C stops it)`);
}

function compileElectronShell(): void {
  const tsc = join(PROJECT_ROOT, 'node_modules', '.bin', 'tsc');
  const result = spawnSync(tsc, ['-p', join(PROJECT_ROOT, 'electron', 'tsconfig.json')], { stdio: 'inherit' });
  if (result.status !== 0) throw new Error('Building the Electron shell failed (see the messages above).');
}

async function startOnFreePort(port: number) {
  try {
    return await startBrowserHost(RENDERER_BUILD_DIR, port);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
    return startBrowserHost(RENDERER_BUILD_DIR, 0);
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
});
