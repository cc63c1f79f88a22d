// Prints the plain closing line "tests: N passed, N failed, N skipped" from vitest's JSON report.
import { readFileSync } from 'node:fs';

const path = process.argv[2] ?? 'test-output/vitest.json';
try {
  const r = JSON.parse(readFileSync(path, 'utf8'));
  const skipped = (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
  console.log(`tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed, ${skipped} skipped`);
  process.exit(r.numTotalTests > 0 && r.numFailedTests === 0 && r.success ? 0 : 1);
} catch (e) {
  console.log(`tests: no report at ${path} (${e.message})`);
  process.exit(1);
}
