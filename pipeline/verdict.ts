// The verdict CI acts on: 1 when an unwaived finding is at or above the failing severity, else 0.
import type { FailOn, Summary } from './types.js';

export function failingCount(summary: Summary, failOn: FailOn): number {
  if (failOn === 'never') return 0;
  return failOn === 'warning' ? summary.errors + summary.warnings : summary.errors;
}

export function exitCodeFor(summary: Summary, failOn: FailOn): 0 | 1 {
  return failingCount(summary, failOn) > 0 ? 1 : 0;
}
