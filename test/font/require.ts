// Test suites that need outside tools or fonts (ots-sanitize, Debian's fontTools,
// the reference fonts). test/support/require-tool.ts decides what a missing one
// means: a skipped suite that names the Debian package to install, or — under
// STEMLINE_REQUIRE_ALL=1 (CI) — a failure, so CI never passes by skipping. This
// file only adapts that to vitest suites with several requirements.
import { describe, it } from 'vitest';
import { checkRequirement, type Requirement } from '../support/require-tool.ts';

/**
 * `describe(name, body)` when every requirement is present; otherwise a skipped
 * suite whose title says what to install, or, under STEMLINE_REQUIRE_ALL=1, a suite
 * with one failing test carrying the same message. The body is only collected when
 * everything is present, so it may load fonts at collection time.
 */
export function describeWith(name: string, requirements: readonly Requirement[], body: () => void): void {
  const missing: string[] = [];
  for (const requirement of requirements) {
    let check: ReturnType<typeof checkRequirement>;
    try {
      check = checkRequirement(requirement);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      describe(name, () => {
        it('has what it needs installed', () => {
          throw new Error(message);
        });
      });
      return;
    }
    if (!check.available) missing.push(check.message);
  }
  if (missing.length === 0) {
    describe(name, body);
    return;
  }
  describe.skip(`${name} — ${missing.join(' ')}`, () => {
    it('needs outside tools', () => undefined);
  });
}
