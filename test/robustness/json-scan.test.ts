// The JSON array reader scans records by bracket depth. A stray closing brace at the top level must
// not stall the scan (it used to emit an unreadable row forever, until memory ran out).
import { describe, expect, it } from 'vitest';
import { readTable } from '../ingest/helpers.js';

describe('JSON array scan', () => {
  it.each([
    ['a stray } after a record', '[\n{"species": "H2O", "phase": "g", "dHf": -241.826}},\n{"species": "CO2", "phase": "g", "dHf": -393.522}\n]\n', { rows: 2, accepted: 1, rejected: 1 }, [2]],
    ['a record that is only }', '[\n{"species": "H2O", "phase": "g", "dHf": -241.826},\n}\n]\n', { rows: 2, accepted: 1, rejected: 1 }, [3]],
    ['an empty element between commas', '[\n{"species": "H2O", "phase": "g", "dHf": -241.826},\n,\n{"species": "CO2", "phase": "g", "dHf": -393.522}\n]\n', { rows: 3, accepted: 2, rejected: 1 }, [3]],
  ] as const)('%s: ends, and every element is accounted for', async (_, text, counts, lines) => {
    const { counts: got, findings } = await readTable(text, 'json');
    expect(got).toEqual(counts);
    expect(findings.filter((f) => f.rule === 'unreadable-row').map((f) => f.location.line)).toEqual(lines);
  }, 10_000);
});
