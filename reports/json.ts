// The JSON report: the Report itself, keys in a fixed order, two-space indent, trailing newline.
import type { Report } from '../pipeline/types.js';

export function renderJson(report: Report): string {
  return JSON.stringify(report, null, 2) + '\n';
}
