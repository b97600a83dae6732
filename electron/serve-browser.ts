// Serves an already built renderer in browser mode: `tsx electron/serve-browser.ts
// --port N`. Used by the Playwright suite's web server and by anyone who wants the
// browser host without a rebuild.
import { startBrowserHost } from './browser-host.ts';
import { RENDERER_BUILD_DIR } from './project-paths.ts';

const portFlag = process.argv.indexOf('--port');
const port = portFlag >= 0 ? Number(process.argv[portFlag + 1]) : 0;
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error('--port takes a whole number from 0 to 65535.');
  process.exit(2);
}
startBrowserHost(RENDERER_BUILD_DIR, port).then(
  (host) => console.log(`Stemline is running at ${host.url}`),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error));
    process.exit(1);
  },
);
