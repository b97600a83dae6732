// Serves an already built renderer in browser mode: `tsx electron/serve-browser.ts
// --port N [--workspace DIR] [--app-folder DIR] [--untitled-folder DIR]`. Used by the
// Playwright suite's web server and by anyone who wants the browser host without a
// rebuild. Projects are kept in the workspace folder (default: the current directory).
// The run's key is random unless the environment variable STEMLINE_BROWSER_TOKEN gives
// one (the test harness does, so its browser can send it); it is never taken from the
// command line, where other users of the machine could read it.
import { startBrowserHost } from './browser-host.ts';
import { RENDERER_BUILD_DIR } from './project-paths.ts';

/** The environment variable that may carry the run's key. */
const TOKEN_VARIABLE = 'STEMLINE_BROWSER_TOKEN';

function flag(name: string): string | undefined {
  const at = process.argv.indexOf(name);
  return at >= 0 ? process.argv[at + 1] : undefined;
}

const portFlag = flag('--port');
const port = portFlag === undefined ? 0 : Number(portFlag);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error('--port takes a whole number from 0 to 65535.');
  process.exit(2);
}
const untitledFolder = flag('--untitled-folder');
const demo = process.argv.includes('--no-demo') ? { demoFolder: null } : {};
const appFolder = flag('--app-folder');
const token = process.env[TOKEN_VARIABLE];
startBrowserHost(RENDERER_BUILD_DIR, port, {
  workspace: flag('--workspace') ?? process.cwd(),
  ...(untitledFolder === undefined ? {} : { untitledFolder }),
  ...(appFolder === undefined ? {} : { appFolder }),
  ...(token === undefined || token === '' ? {} : { token }),
  ...demo,
}).then(
  (host) => console.log(`Stemline is running at ${host.url}`),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error));
    process.exit(1);
  },
);
