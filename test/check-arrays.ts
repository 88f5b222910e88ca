// check() for tests that read findings with array methods: the report's findings (a finding store,
// made as read) as an array.
import { check, type RunInfo } from '../pipeline/check.js';
import type { Finding, OptionsNormalized, Report } from '../pipeline/types.js';

export type ArrayReport = Omit<Report, 'findings'> & { findings: Finding[] };

export async function checkArrays(options: OptionsNormalized, run: RunInfo): Promise<ArrayReport> {
  const report = await check(options, run);
  return { ...report, findings: [...report.findings] };
}
