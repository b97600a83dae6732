// Minimal JUnit XML writing and reading: the type-check step writes its results in
// the same report format the test runners use, and .ci/run totals every report
// into the closing "N passed, N failed" line.
import { readFileSync } from 'node:fs';

export interface CaseResult {
  name: string;
  /** Failure text, or undefined when the case passed. */
  failure?: string;
  skipped?: string;
}

function escapeXml(text: string): string {
  return text.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[c] ?? c);
}

/** A JUnit document with one suite holding the given cases. */
export function junitXml(suite: string, cases: readonly CaseResult[]): string {
  const failures = cases.filter((c) => c.failure !== undefined).length;
  const skipped = cases.filter((c) => c.skipped !== undefined).length;
  const body = cases
    .map((c) => {
      const inner = c.failure !== undefined
        ? `<failure message="failed">${escapeXml(c.failure)}</failure>`
        : c.skipped !== undefined ? `<skipped message="${escapeXml(c.skipped)}"/>` : '';
      return `    <testcase classname="${escapeXml(suite)}" name="${escapeXml(c.name)}">${inner}</testcase>`;
    })
    .join('\n');
  return `<?xml version="1.0" encoding="UTF-8"?>\n<testsuites>\n  <testsuite name="${escapeXml(suite)}" tests="${cases.length}" failures="${failures}" skipped="${skipped}">\n${body}\n  </testsuite>\n</testsuites>\n`;
}

export interface Totals {
  passed: number;
  failed: number;
  skipped: number;
}

/**
 * Counts test cases in a JUnit report: a case with <failure> or <error> failed,
 * one with <skipped> was skipped, any other passed.
 */
export function countJunit(xml: string): Totals {
  const totals: Totals = { passed: 0, failed: 0, skipped: 0 };
  const casePattern = /<testcase\b[^>]*?(\/>|>([\s\S]*?)<\/testcase>)/g;
  for (const match of xml.matchAll(casePattern)) {
    const inner = match[2] ?? '';
    if (/<(failure|error)\b/.test(inner)) totals.failed += 1;
    else if (/<skipped\b/.test(inner)) totals.skipped += 1;
    else totals.passed += 1;
  }
  return totals;
}

export function countJunitFile(path: string): Totals {
  return countJunit(readFileSync(path, 'utf8'));
}
