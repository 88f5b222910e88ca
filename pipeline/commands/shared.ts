// What every command shares: the tool version, the report timestamp, the terminal's colour choice.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { packageRoot } from '../paths.js';

export const version = (JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version: string }).version;

/** One timestamp per report; fixed by --deterministic or SOURCE_DATE_EPOCH (seconds) so reruns compare byte for byte. */
export function generatedAt(deterministic: boolean): string {
  const epoch = process.env.SOURCE_DATE_EPOCH;
  if (epoch !== undefined && /^\d+$/.test(epoch)) return new Date(Number(epoch) * 1000).toISOString();
  return deterministic ? new Date(0).toISOString() : new Date().toISOString();
}

/**
 * The day waiver expiry is judged against, YYYY-MM-DD: SOURCE_DATE_EPOCH's day when set, else the clock's.
 * --deterministic fixes only the report timestamp, never the verdict: an expired waiver stays expired.
 */
export function waiverDay(): string {
  const epoch = process.env.SOURCE_DATE_EPOCH;
  const ms = epoch !== undefined && /^\d+$/.test(epoch) ? Number(epoch) * 1000 : Date.now();
  return new Date(ms).toISOString().slice(0, 10);
}

/** Colour only on a terminal, and never when NO_COLOR is set, TERM is dumb or --no-color was given. */
export function useColor(flag: boolean, stream: NodeJS.WriteStream = process.stdout): boolean {
  return flag && !!stream.isTTY && process.env.NO_COLOR === undefined && process.env.TERM !== 'dumb';
}
