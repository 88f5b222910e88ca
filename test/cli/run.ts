// Run the built CLI as a user would, capturing exit code and output.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { Ajv } from 'ajv';
import addFormats from 'ajv-formats';

export const CLI = 'dist/pipeline/cli.js';

export function thermovet(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1', ...env } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const ajv = new Ajv({ allErrors: true, strict: false });
addFormats.default(ajv);
const validateReport = ajv.compile(JSON.parse(readFileSync('schemas/report.schema.json', 'utf8')));

/** Every report the tests produce goes through this: it must validate against schemas/report.schema.json. */
export function readReport(path: string): any {
  const data = JSON.parse(readFileSync(path, 'utf8'));
  if (!validateReport(data)) throw new Error(`report ${path} does not validate: ${ajv.errorsText(validateReport.errors)}`);
  return data;
}

export const NO_STACK = /^\s+at .+\(.*:\d+:\d+\)$|^\s+at .+:\d+:\d+$/m;
