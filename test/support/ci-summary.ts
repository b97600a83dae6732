// Prints the closing line CI reads, "N passed, N failed" (", N skipped" after it
// when any were skipped), totalled over every JUnit report in test-results/.
// Exits 1 when no report exists or any case failed.
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { countJunitFile } from './junit.ts';

const resultsDir = fileURLToPath(new URL('../../test-results', import.meta.url));
const reports = existsSync(resultsDir) ? readdirSync(resultsDir).filter((f) => f.endsWith('-junit.xml')) : [];
let passed = 0;
let failed = 0;
let skipped = 0;
for (const report of reports.sort()) {
  const totals = countJunitFile(join(resultsDir, report));
  console.log(`${report}: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
  passed += totals.passed;
  failed += totals.failed;
  skipped += totals.skipped;
}
console.log(`${passed} passed, ${failed} failed${skipped > 0 ? `, ${skipped} skipped` : ''}`);
process.exitCode = reports.length === 0 || failed > 0 ? 1 : 0;
