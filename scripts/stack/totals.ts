// Counting and printing suite results for `npm test`; the last line is "N passed, N failed[, N skipped]".

export type SuiteResult = { name: string; passed: number; failed: number; skipped: number; seconds: number; note?: string };

export function totalsLine(results: SuiteResult[]): string {
  const sum = (k: 'passed' | 'failed' | 'skipped') => results.reduce((n, r) => n + r[k], 0);
  const skipped = sum('skipped');
  return `${sum('passed')} passed, ${sum('failed')} failed${skipped ? `, ${skipped} skipped` : ''}`;
}

export function summaryTable(results: SuiteResult[]): string {
  const width = Math.max(...results.map((r) => r.name.length), 5);
  return results
    .map((r) => {
      const mark = r.failed > 0 ? '✗' : '✓';
      const counts = `${r.passed} passed, ${r.failed} failed${r.skipped ? `, ${r.skipped} skipped` : ''}`;
      return `${mark} ${r.name.padEnd(width)}  ${counts.padEnd(30)} ${r.seconds.toFixed(1).padStart(6)} s${r.note ? `  ${r.note}` : ''}`;
    })
    .join('\n');
}

/** A pass/fail step (lint, typecheck, build) counts as one test. */
export function stepResult(name: string, ok: boolean, seconds: number, note?: string): SuiteResult {
  return { name, passed: ok ? 1 : 0, failed: ok ? 0 : 1, skipped: 0, seconds, note };
}

type VitestJson = {
  numPassedTests?: number;
  numFailedTests?: number;
  numPendingTests?: number;
  numTodoTests?: number;
  testResults?: { status?: string; name?: string; assertionResults?: unknown[]; message?: string }[];
};

/**
 * Counts a vitest JSON report. A file that failed before any test ran (import error) counts as one failure,
 * and a non-zero exit with nothing failed in the report (an unhandled error) counts as one more.
 */
export function countVitest(name: string, report: unknown, exitCode: number, seconds: number): SuiteResult {
  if (typeof report !== 'object' || report === null || !('numPassedTests' in report)) {
    return { name, passed: 0, failed: 1, skipped: 0, seconds, note: `no report (exit code ${exitCode})` };
  }
  const r = report as VitestJson;
  const brokenFiles = (r.testResults ?? []).filter((f) => f.status === 'failed' && (f.assertionResults ?? []).length === 0).length;
  let failed = (r.numFailedTests ?? 0) + brokenFiles;
  const notes: string[] = [];
  if (brokenFiles) notes.push(`${brokenFiles} file(s) failed to load`);
  if (exitCode !== 0 && failed === 0) {
    failed = 1;
    notes.push(`vitest exited with code ${exitCode}`);
  }
  const passed = r.numPassedTests ?? 0;
  if (passed + failed === 0) notes.push('no test files');
  return { name, passed, failed, skipped: (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0), seconds, note: notes.join('; ') || undefined };
}
