// Adds up vitest's JSON reports and prints the closing line CI reads: "N passed, N failed".
// A report that is missing (its runner crashed) counts as one failure.
import fs from 'node:fs';

let passed = 0;
let failed = 0;
let skipped = 0;
for (const file of process.argv.slice(2)) {
  if (!fs.existsSync(file)) {
    console.error(`missing test report: ${file}`);
    failed += 1;
    continue;
  }
  const report = JSON.parse(fs.readFileSync(file, 'utf8'));
  passed += report.numPassedTests ?? 0;
  failed += report.numFailedTests ?? 0;
  skipped += (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
  // A file that failed to load has no tests but is a failure all the same.
  failed += (report.testResults ?? []).filter(
    (r) => r.status === 'failed' && (r.assertionResults ?? []).length === 0,
  ).length;
}
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed > 0 ? 1 : 0);
