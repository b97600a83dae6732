// The warning table of the user guide (docs/guide/05-checks.md) against the code: every
// warning kind the outline checks (core/checks) and the fit's report (core/fit
// quality-report.ts) can give is listed once, nothing else is; the guide offers a
// one-click fix exactly where core/document/warning-fixes.ts has one; and it says
// where each kind is reported — the app, `check`, `trace` and `build` — as the code does.
import { describe, expect, it } from 'vitest';
import type { OutlineWarning, OutlineWarningKind } from '../../core/checks/index.ts';
import type { FitWarningKind } from '../../core/fit/index.ts';
import { hasFix } from '../../core/document/index.ts';
import { codeSpans, guideChapter, projectFile, tableRows } from './guide-text.ts';

/** The string literals of the union type `name` as declared in `file`. */
function unionMembers(file: string, name: string): string[] {
  const declaration = new RegExp(`export type ${name}\\s*=([^;]*);`).exec(projectFile(file));
  if (!declaration) throw new Error(`${file} declares no type ${name}`);
  return [...declaration[1]!.matchAll(/'([^']+)'/g)].map((m) => m[1]!);
}

// Typed against the unions, so that the compiler also notices a kind added to either.
const OUTLINE_KINDS: Record<OutlineWarningKind, true> = {
  'extremum-inside-segment': true,
  'near-miss-kink': true,
  'crossing-handles': true,
  'off-grid-point': true,
  'tiny-segment': true,
  'wrong-direction': true,
};
const FIT_KINDS: Record<FitWarningKind, true> = {
  'tolerance-exceeded': true,
  'extremum-inside-segment': true,
  'near-miss-kink': true,
  'crossing-handles': true,
};

const outlineKinds = unionMembers('core/checks/outline-checks.ts', 'OutlineWarningKind');
const fitKinds = unionMembers('core/fit/quality-report.ts', 'FitWarningKind');
/** The fit's warnings the app shows beside the outline checks' (renderer/src/editor/letter-document.ts). */
const appFitKinds = [...projectFile('renderer/src/editor/letter-document.ts').matchAll(/\.filter\(\(w\) => w\.kind === '([^']+)'\)/g)].map((m) => m[1]!);

const rows = tableRows(guideChapter('05-checks.md'), ['warning', 'kind', 'what it means', 'one-click fix', 'reported by']).map(([name, kind, meaning, fix, reportedBy]) => {
  const kinds = codeSpans(kind!);
  if (kinds.length !== 1) throw new Error(`the row for "${name}" names ${kinds.length} kinds; give exactly one`);
  return { kind: kinds[0]!, meaning: meaning!, fix: fix!, reportedBy: reportedBy!, line: `| ${name} | ${kind} | … |` };
});

describe('the guide\'s warnings', () => {
  it('reads the kinds from the code as the types declare them', () => {
    expect(outlineKinds.sort()).toEqual(Object.keys(OUTLINE_KINDS).sort());
    expect(fitKinds.sort()).toEqual(Object.keys(FIT_KINDS).sort());
    expect(appFitKinds).toEqual(['tolerance-exceeded']);
  });

  it('lists every warning kind the code has, once, and no other', () => {
    const documented = rows.map((r) => r.kind);
    expect(new Set(documented).size, 'a kind is listed twice').toBe(documented.length);
    expect(documented.sort()).toEqual([...new Set([...outlineKinds, ...fitKinds])].sort());
  });

  it('offers a one-click fix exactly where the app has one', () => {
    for (const row of rows) {
      // The app's Fix button acts on outline-check warnings only (renderer/src/screens/OneLetter.svelte: warning.check && hasFix).
      const fixable = outlineKinds.includes(row.kind) && hasFix({ kind: row.kind } as OutlineWarning);
      if (fixable) expect(row.fix, `${row.kind} has a Fix button`).toMatch(/^\*\*Fix\*\*/);
      else expect(row.fix, `${row.kind} has no Fix button`).toMatch(/^none\b/);
    }
    expect(rows.filter((r) => r.fix.startsWith('**Fix**')).length).toBeGreaterThan(0);
  });

  it('says where each kind is reported: the app, check, trace and build', () => {
    for (const row of rows) {
      const words = new Set(row.reportedBy.split(/[,\s]+/).map((w) => w.replace(/`/g, '')).filter((w) => w !== ''));
      const inApp = outlineKinds.includes(row.kind) || appFitKinds.includes(row.kind);
      const expected = new Set([...(inApp ? ['app'] : []), ...(outlineKinds.includes(row.kind) ? ['check'] : []), ...(fitKinds.includes(row.kind) ? ['trace', 'build'] : [])]);
      expect([...words].sort(), row.line).toEqual([...expected].sort());
    }
  });
});
