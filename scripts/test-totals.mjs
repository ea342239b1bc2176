// Adds up the JSON reports of every test runner in a folder and prints "Tests: N passed, N failed".
// Exits 1 when a test failed or when no report was found.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const dir = process.argv[2] ?? 'test-results';
let passed = 0;
let failed = 0;
let reports = 0;

/** Counts the tests of a Playwright JSON report. */
function countPlaywright(report) {
  const walk = (suite) => {
    for (const spec of suite.specs ?? []) {
      for (const t of spec.tests ?? []) {
        const status = t.results?.at(-1)?.status;
        if (t.status === 'skipped' || status === 'skipped') continue;
        if (t.status === 'expected' || t.status === 'flaky') passed++;
        else failed++;
      }
    }
    for (const child of suite.suites ?? []) walk(child);
  };
  for (const suite of report.suites ?? []) walk(suite);
  failed += report.errors?.length ?? 0;
}

for (const name of readdirSync(dir).filter((f) => f.endsWith('.json')).sort()) {
  const report = JSON.parse(readFileSync(join(dir, name), 'utf8'));
  reports++;
  if ('numPassedTests' in report) {
    // vitest's (Jest-compatible) JSON reporter
    passed += report.numPassedTests;
    failed += report.numFailedTests;
    if (report.numFailedTestSuites && !report.numFailedTests) failed += report.numFailedTestSuites;
  } else if ('suites' in report && 'stats' in report) {
    countPlaywright(report);
  }
}

console.log(`Tests: ${passed} passed, ${failed} failed`);
process.exit(failed > 0 || reports === 0 ? 1 : 0);
