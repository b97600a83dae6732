// Finds a system tool or data file a test needs. Where it is missing, the test is
// skipped with a message naming the Debian package to install — unless
// STEMLINE_REQUIRE_ALL=1 (set by .ci/run), which turns every such skip into a
// failure so CI never passes by skipping.
import { existsSync } from 'node:fs';

/** Environment variable that makes a missing tool a test failure instead of a skip. */
export const REQUIRE_ALL_VARIABLE = 'STEMLINE_REQUIRE_ALL';

export interface Requirement {
  /** What is needed, e.g. "Chromium". */
  what: string;
  /** Path that must exist, e.g. "/usr/bin/chromium". */
  path: string;
  /** How to get it, e.g. "apt-get install chromium". */
  install: string;
}

export interface RequirementCheck {
  available: boolean;
  /** Message for the skip (or the failure under STEMLINE_REQUIRE_ALL=1). */
  message: string;
}

export function requireAllIsSet(): boolean {
  return process.env[REQUIRE_ALL_VARIABLE] === '1';
}

/**
 * Checks a requirement. Returns `available: false` with a skip message when it is
 * missing; throws instead when STEMLINE_REQUIRE_ALL=1.
 */
export function checkRequirement(requirement: Requirement): RequirementCheck {
  if (existsSync(requirement.path)) return { available: true, message: '' };
  const message = `${requirement.what} not found at ${requirement.path}: install it with "${requirement.install}".`;
  if (requireAllIsSet()) throw new Error(`${message} (${REQUIRE_ALL_VARIABLE}=1 makes this a failure.)`);
  return { available: false, message: `skipped: ${message}` };
}

/** Debian's Chromium, used by Playwright through executablePath. */
export const CHROMIUM: Requirement = { what: 'Chromium', path: '/usr/bin/chromium', install: 'apt-get install chromium' };
/** The OpenType sanitizer browsers use. */
export const OTS_SANITIZE: Requirement = { what: 'ots-sanitize', path: '/usr/bin/ots-sanitize', install: 'apt-get install opentype-sanitizer' };
/** Debian's Python, which carries fontTools. */
export const FONTTOOLS_PYTHON: Requirement = { what: 'fontTools (Debian python3)', path: '/usr/lib/python3/dist-packages/fontTools/__init__.py', install: 'apt-get install python3-fonttools' };

/** Reference fonts from Debian's packages. */
export const REFERENCE_FONTS = {
  cantarellRegular: { what: 'Cantarell Regular', path: '/usr/share/fonts/opentype/cantarell/Cantarell-Regular.otf', install: 'apt-get install fonts-cantarell' },
  libertineRegular: { what: 'Linux Libertine Regular', path: '/usr/share/fonts/opentype/linux-libertine/LinLibertine_R.otf', install: 'apt-get install fonts-linuxlibertine' },
  dejavuSans: { what: 'DejaVu Sans', path: '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf', install: 'apt-get install fonts-dejavu-core' },
} satisfies Record<string, Requirement>;
