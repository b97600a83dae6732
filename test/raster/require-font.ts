// Reference-font suites for the raster tests. The fonts come from Debian packages, and
// test/support/require-tool.ts decides what a missing one means: a skipped suite that
// names the package to install, or — under STEMLINE_REQUIRE_ALL=1 (CI) — a failure,
// so CI never passes by skipping. This file only adapts that to vitest suites.

import { describe, it } from 'vitest';
import { checkRequirement, REFERENCE_FONTS, type Requirement } from '../support/require-tool.ts';

export interface ReferenceFont extends Requirement {
  /** Human name used in test titles. */
  readonly label: string;
}

export const CANTARELL: ReferenceFont = { ...REFERENCE_FONTS.cantarellRegular, label: 'Cantarell Regular' };
export const LIBERTINE: ReferenceFont = { ...REFERENCE_FONTS.libertineRegular, label: 'Linux Libertine Regular' };
export const DEJAVU_SANS: ReferenceFont = { ...REFERENCE_FONTS.dejavuSans, label: 'DejaVu Sans' };

/**
 * `describe(name, body)` when the font is installed; otherwise a skipped suite whose
 * title says which package to install, or, under STEMLINE_REQUIRE_ALL=1, a suite with
 * one failing test carrying the same message. The body may load the font at
 * collection time: it only runs when the font exists.
 */
export function describeWithFont(name: string, font: ReferenceFont, body: () => void): void {
  let check: ReturnType<typeof checkRequirement>;
  try {
    check = checkRequirement(font);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    describe(name, () => {
      it('has its reference font installed', () => {
        throw new Error(message);
      });
    });
    return;
  }
  if (check.available) {
    describe(name, body);
    return;
  }
  // The body is not collected: it would load the missing font.
  describe.skip(`${name} — ${check.message}`, () => {
    it('needs its reference font', () => undefined);
  });
}
