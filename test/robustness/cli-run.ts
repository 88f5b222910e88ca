// Run the built CLI as a user would, and the checks every robustness case shares.
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Ajv } from 'ajv';
import addFormats from 'ajv-formats';

export const ROOT = process.cwd();
// THERMOVET_CLI points at another build (e.g. a private one while others rebuild dist/)
const CLI = process.env.THERMOVET_CLI ?? join(ROOT, 'dist', 'pipeline', 'cli.js');

export interface CliResult {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: string[], env: Record<string, string> = {}): CliResult {
  const r = spawnSync(process.execPath, [CLI, ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', ...env },
    maxBuffer: 64 * 1024 * 1024,
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** What must never reach a user: stack frames, Node's own error names, an internal error. */
const LEAKS: [RegExp, string][] = [
  [/^\s+at .+:\d+:\d+\)?$/m, 'a stack frame'],
  [/^\s+at (async )?[\w.<>]+ \(/m, 'a stack frame'],
  [/node:internal/, 'a Node internal path'],
  [/\b(TypeError|RangeError|SyntaxError|ReferenceError|AssertionError)\b/, 'a JavaScript error name'],
  [/^Error: /m, 'a raw Error'],
  [/internal error/, 'an internal error'],
];

export function leaks(text: string): string[] {
  return LEAKS.filter(([re]) => re.test(text)).map(([, what]) => what);
}

/** The same, without blocking: lets a catalogue run its cases side by side. */
export function runCliAsync(args: string[], env: Record<string, string> = {}): Promise<CliResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CLI, ...args], { cwd: ROOT, env: { ...process.env, NO_COLOR: '1', ...env } });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (b: Buffer) => out.push(b));
    child.stderr.on('data', (b: Buffer) => err.push(b));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8') }));
  });
}

const ajv = new Ajv({ allErrors: true, strict: false });
addFormats.default(ajv);
const validate = ajv.compile(JSON.parse(readFileSync(join(ROOT, 'schemas', 'report.schema.json'), 'utf8')));

/** A report that validates against schemas/report.schema.json, or an exception saying why not. */
export function readValidReport(path: string): any {
  const data = JSON.parse(readFileSync(path, 'utf8'));
  if (!validate(data)) throw new Error(`${path} does not validate: ${ajv.errorsText(validate.errors)}`);
  return data;
}
