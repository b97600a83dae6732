// Finds the Electron binary installed with the `electron` package, or explains why
// there is none. The package installs without its binary where downloads are
// blocked (ELECTRON_SKIP_BINARY_DOWNLOAD=1) or is left out when its optional
// install fails; the launcher then falls back to the browser-mode host.
import { createRequire } from 'node:module';
import { existsSync } from 'node:fs';

export type ElectronLocation =
  | { found: true; binary: string }
  | { found: false; reason: string };

/** Looks for a usable Electron binary without starting it. */
export function locateElectron(): ElectronLocation {
  const require = createRequire(import.meta.url);
  let binary: unknown;
  try {
    binary = require('electron');
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const reason = /Cannot find module/.test(message)
      ? 'the electron package is not installed'
      : 'the electron package is installed without its binary';
    return { found: false, reason };
  }
  if (typeof binary !== 'string' || !existsSync(binary)) {
    return { found: false, reason: 'the electron binary is missing from node_modules/electron/dist' };
  }
  return { found: true, binary };
}
