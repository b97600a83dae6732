// Reference fonts for the raster tests come from Debian packages. A missing font skips
// its tests with a message naming the package, except under STEMLINE_REQUIRE_ALL=1
// (CI), where a missing font must fail loudly instead of passing by skipping.

import { existsSync } from 'node:fs';
import { describe, it } from 'vitest';

export interface ReferenceFont {
  readonly label: string;
  readonly path: string;
  /** The Debian package that installs `path`. */
  readonly debianPackage: string;
}

export const CANTARELL: ReferenceFont = { label: 'Cantarell Regular', path: '/usr/share/fonts/opentype/cantarell/Cantarell-Regular.otf', debianPackage: 'fonts-cantarell' };
export const LIBERTINE: ReferenceFont = { label: 'Linux Libertine Regular', path: '/usr/share/fonts/opentype/linux-libertine/LinLibertine_R.otf', debianPackage: 'fonts-linuxlibertine' };
export const DEJAVU_SANS: ReferenceFont = { label: 'DejaVu Sans', path: '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf', debianPackage: 'fonts-dejavu-core' };

function requireAll(): boolean {
  return process.env['STEMLINE_REQUIRE_ALL'] === '1';
}

/**
 * `describe(name, body)` when the font is installed. Otherwise a skipped suite whose
 * name says which Debian package to install — or, under STEMLINE_REQUIRE_ALL=1, a
 * suite with one failing test saying the same.
 */
export function describeWithFont(name: string, font: ReferenceFont, body: () => void): void {
  if (existsSync(font.path)) {
    describe(name, body);
    return;
  }
  const message = `${font.label} is missing (${font.path}); install the Debian package ${font.debianPackage}`;
  if (requireAll()) {
    describe(name, () => {
      it('has its reference font installed', () => {
        throw new Error(`${message} (STEMLINE_REQUIRE_ALL=1 forbids skipping).`);
      });
    });
  } else {
    describe.skip(`${name} — skipped: ${message}`, body);
  }
}
