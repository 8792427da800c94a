// Sums the unit, API and end-to-end results into one closing line; a suite that left no report counts as failed.
import { existsSync, readFileSync } from 'node:fs';

let passed = 0;
let failed = 0;
for (const name of ['unit', 'api']) {
  const file = `test-results/${name}.json`;
  if (!existsSync(file)) { console.log(`${name}: no report`); failed += 1; continue; }
  const r = JSON.parse(readFileSync(file, 'utf8'));
  passed += r.numPassedTests;
  failed += r.numFailedTests + (r.numTotalTestSuites > 0 && r.success === false && r.numFailedTests === 0 ? 1 : 0);
  if (r.numPendingTests || r.numTodoTests) console.log(`${name}: ${r.numPendingTests + r.numTodoTests} skipped`);
}
const e2eFile = 'test-results/e2e.json';
if (!existsSync(e2eFile)) { console.log('e2e: no report'); failed += 1; }
else {
  const s = JSON.parse(readFileSync(e2eFile, 'utf8')).stats;
  passed += s.expected + s.flaky;
  failed += s.unexpected;
  if (s.skipped) console.log(`e2e: ${s.skipped} skipped`);
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
