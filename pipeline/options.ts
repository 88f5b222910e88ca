// Options as users write them (CLI flags, manifest) -> one complete OptionsNormalized, validated once.
import { existsSync, readFileSync, statSync } from 'node:fs';
import { basename, dirname, resolve, relative, isAbsolute } from 'node:path';
import { InputError, excerpt } from './errors.js';
import { COLUMN_BY_NAME } from './ingest/columns.js';
import { formatFromPath, type TableFormat } from './ingest/events.js';
import { loadStructured } from './ingest/structured.js';
import { findUnit, unitsOf } from './units/table.js';
import type { FailOn, OptionsNormalized } from './types.js';

export interface Options {
  tables: string[];
  manifest?: string;
  format?: string;
  reactions?: string;
  waivers?: string;
  failOn?: string;
}

export interface Manifest {
  name?: string;
  description?: string;
  tables: (string | { path: string; format?: TableFormat })[];
  columns?: Record<string, string>;
  units?: Record<string, string>;
  use_window?: { Tmin?: number; Tmax?: number; temperatures?: number[] };
  reactions?: string;
  waivers?: string;
  tolerances?: { gibbs_error_kJmol?: number; gibbs_warning_kJmol?: number };
}

export const DEFAULT_TOLERANCES = { gibbsErrorKJ: 0.5, gibbsWarningKJ: 0.1 };
const FORMATS: readonly TableFormat[] = ['csv', 'tsv', 'json', 'ndjson'];

/** Paths in reports are shown relative to the working directory when inside it, so reports do not depend on where the checkout lives. */
export function displayPath(p: string): string {
  const abs = resolve(p);
  const rel = relative(process.cwd(), abs);
  return rel && !rel.startsWith('..') && !isAbsolute(rel) ? rel : abs;
}

function isDirectory(path: string, manifest?: string): boolean {
  try {
    return statSync(manifest ? resolve(dirname(resolve(manifest)), path) : path).isDirectory();
  } catch {
    return false; // a missing file is reported when it is read
  }
}

/** A file the manifest names must exist; if not, the message points at the manifest's line. */
function requireListed(path: string, listedAs: string, manifest: string, field: string): void {
  if (existsSync(path)) return;
  throw new InputError('missing-file', `${field} "${excerpt(listedAs)}" named in the manifest: no such file (looked for ${excerpt(path, 200)})`, {
    file: manifest,
    line: lineOfText(manifest, listedAs),
    field,
  });
}

function lineOfText(file: string, needle: string): number | undefined {
  try {
    const idx = readFileSync(file, 'utf8').split(/\r?\n/).findIndex((l) => l.includes(needle));
    return idx === -1 ? undefined : idx + 1;
  } catch {
    return undefined;
  }
}

export function normalizeOptions(o: Options): OptionsNormalized {
  const failOn = (o.failOn ?? 'error') as FailOn;
  if (!['error', 'warning', 'never'].includes(failOn)) {
    throw new InputError('bad-option', `--fail-on must be error, warning or never, not "${excerpt(String(o.failOn))}"`);
  }
  if (o.format !== undefined && !FORMATS.includes(o.format as TableFormat)) {
    throw new InputError('bad-option', `--format must be one of ${FORMATS.join(', ')}, not "${excerpt(o.format)}"`);
  }
  let manifest: Manifest | undefined;
  let base = process.cwd();
  if (o.manifest) {
    manifest = loadStructured<Manifest>(o.manifest, 'manifest.schema.json', 'manifest');
    base = dirname(resolve(o.manifest));
  }
  const fromManifest = (p: string): string => displayPath(resolve(base, p));

  const tables: OptionsNormalized['tables'] = [];
  if (o.tables.length) {
    for (const t of o.tables) tables.push({ path: displayPath(t), format: pickFormat(t, o.format) });
  } else if (manifest) {
    for (const t of manifest.tables) {
      const path = typeof t === 'string' ? t : t.path;
      const format = pickFormat(path, typeof t === 'string' ? undefined : t.format, o.manifest);
      requireListed(resolve(base, path), path, o.manifest!, 'tables');
      tables.push({ path: fromManifest(path), format });
    }
  }
  if (tables.length === 0) throw new InputError('no-tables', 'no table to check: give table files, or a manifest that lists them');

  const units: Record<string, string> = {};
  for (const [col, unit] of Object.entries(manifest?.units ?? {})) {
    const dim = COLUMN_BY_NAME.get(col)?.dimension;
    const u = dim ? findUnit(unit, dim) : undefined;
    if (!dim || !u) {
      throw new InputError('unknown-unit', `unknown unit "${excerpt(unit)}" for column ${col}; accepted: ${dim ? unitsOf(dim).join(', ') : 'none'}`, {
        file: o.manifest,
        line: o.manifest ? lineOfText(o.manifest, unit) : undefined,
        field: `units.${col}`,
      });
    }
    units[col] = u.name;
  }

  const w = manifest?.use_window;
  if (w?.Tmin !== undefined && w.Tmax !== undefined && w.Tmin >= w.Tmax) {
    throw new InputError('bad-window', `use_window: Tmin ${w.Tmin} K must be below Tmax ${w.Tmax} K`, { file: o.manifest, line: o.manifest ? lineOfText(o.manifest, 'Tmin') : undefined, field: 'use_window' });
  }
  const useWindow = w ? { ...w, ...(w.temperatures ? { temperatures: [...w.temperatures].sort((a, b) => a - b) } : {}) } : {};
  if (!o.reactions && manifest?.reactions) requireListed(resolve(base, manifest.reactions), manifest.reactions, o.manifest!, 'reactions');
  if (!o.waivers && manifest?.waivers) requireListed(resolve(base, manifest.waivers), manifest.waivers, o.manifest!, 'waivers');
  const reactionsFile = o.reactions ? displayPath(o.reactions) : manifest?.reactions ? fromManifest(manifest.reactions) : undefined;
  const waiversFile = o.waivers ? displayPath(o.waivers) : manifest?.waivers ? fromManifest(manifest.waivers) : undefined;
  const tol = manifest?.tolerances ?? {};
  const out: OptionsNormalized = {
    name: manifest?.name ?? (o.manifest ? basename(dirname(resolve(o.manifest))) : basename(tables[0]!.path)),
    tables,
    headerMap: manifest?.columns ?? {},
    units,
    useWindow,
    tolerances: {
      gibbsErrorKJ: tol.gibbs_error_kJmol ?? DEFAULT_TOLERANCES.gibbsErrorKJ,
      gibbsWarningKJ: tol.gibbs_warning_kJmol ?? DEFAULT_TOLERANCES.gibbsWarningKJ,
    },
    failOn,
  };
  if (o.manifest) out.manifestPath = displayPath(o.manifest);
  if (reactionsFile) out.reactionsFile = reactionsFile;
  if (waiversFile) out.waiversFile = waiversFile;
  return out;
}

function pickFormat(path: string, declared: string | undefined, manifest?: string): TableFormat {
  if (isDirectory(path, manifest)) throw new InputError('not-a-file', 'is a directory, not a table file', { file: path });
  if (declared) return declared as TableFormat;
  const f = formatFromPath(path);
  if (!f) {
    throw new InputError('unknown-format', `cannot tell the table format from the extension of "${excerpt(path)}"; use --format csv|tsv|json|ndjson${manifest ? ' or format: in the manifest' : ''}`, { file: manifest ?? path });
  }
  return f;
}
