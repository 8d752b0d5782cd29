// Adds up the vitest and Playwright JSON reports and the lint result into the one closing line CI reads.
import { existsSync, readFileSync } from 'node:fs';

const [vitestFile, playwrightFile, lintFile] = process.argv.slice(2);
let passed = 0;
let failed = 0;
const notes = [];

if (existsSync(vitestFile)) {
  const v = JSON.parse(readFileSync(vitestFile, 'utf8'));
  passed += v.numPassedTests ?? 0;
  failed += v.numFailedTests ?? 0;
  // A test file that failed with no failed test of its own (it could not load, or a beforeAll or
  // afterAll hook failed and its tests were skipped) counts as a failure of its own.
  const brokenFiles = (v.testResults ?? []).filter(
    (f) => f.status === 'failed' && !(f.assertionResults ?? []).some((a) => a.status === 'failed'),
  ).length;
  failed += brokenFiles;
  notes.push(`vitest: ${v.numPassedTests} passed, ${v.numFailedTests + brokenFiles} failed`);
} else {
  failed += 1;
  notes.push('vitest: no report (the run did not finish)');
}

if (existsSync(playwrightFile)) {
  const p = JSON.parse(readFileSync(playwrightFile, 'utf8'));
  const s = p.stats ?? {};
  passed += (s.expected ?? 0) + (s.flaky ?? 0);
  failed += s.unexpected ?? 0;
  const errors = (p.errors ?? []).length;
  failed += errors;
  notes.push(`playwright: ${(s.expected ?? 0) + (s.flaky ?? 0)} passed, ${(s.unexpected ?? 0) + errors} failed`);
} else {
  failed += 1;
  notes.push('playwright: no report (the run did not finish)');
}

// The linter counts as one suite: one pass or one failure.
if (lintFile) {
  const lint = existsSync(lintFile) ? readFileSync(lintFile, 'utf8').trim() : 'missing';
  if (lint === 'passed') passed += 1;
  else failed += 1;
  notes.push(`lint: ${lint === 'passed' ? 'clean' : lint === 'failed' ? 'problems found' : 'did not run'}`);
}

console.log(`\n${notes.join('; ')}`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
