// YAML or JSON documents (manifest, waivers) validated by a JSON Schema, with errors located by line.
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { Ajv, type ErrorObject, type ValidateFunction } from 'ajv';
import addFormats from 'ajv-formats';
import { LineCounter, isMap, isSeq, parseDocument, type Node } from 'yaml';
import { InputError, excerpt } from '../errors.js';
import { packageRoot } from '../paths.js';

const ajv = new Ajv({ allErrors: true, strict: false });
addFormats.default(ajv);
const compiled = new Map<string, ValidateFunction>();

/** Compile a schema from schemas/ once. */
export function schemaValidator(file: string): ValidateFunction {
  let v = compiled.get(file);
  if (!v) {
    v = ajv.compile(JSON.parse(readFileSync(join(packageRoot(), 'schemas', file), 'utf8')));
    compiled.set(file, v);
  }
  return v;
}

const MAX_DOC_BYTES = 16 * 1024 * 1024;

/** Reads `path` as YAML (JSON is YAML too), validates it against `schemas/<schemaFile>`; errors name the line. */
export function loadStructured<T>(path: string, schemaFile: string, what: string): T {
  let text: string;
  try {
    const st = statSync(path);
    if (st.isDirectory()) throw new InputError('not-a-file', `${what} is a directory, not a file`, { file: path });
    if (st.size > MAX_DOC_BYTES) throw new InputError('file-too-large', `${what} has ${st.size} bytes; the limit is ${MAX_DOC_BYTES}`, { file: path });
    text = readFileSync(path, 'utf8').replace(/^\uFEFF/, '');
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? 'missing-file' : 'unreadable-file', code === 'ENOENT' ? `${what}: no such file` : `${what} cannot be read (${code})`, { file: path });
  }
  if (text.includes('\u0000')) throw new InputError('binary-file', `${what} holds NUL bytes: it is binary or UTF-16, not UTF-8 text`, { file: path, line: 1 });
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, uniqueKeys: true });
  const lineAt = (offset: number): number => lines.linePos(offset).line;
  if (doc.errors.length) {
    const e = doc.errors[0]!;
    throw new InputError('bad-document', `${what} is not valid YAML or JSON: ${excerpt(e.message.split('\n')[0] ?? '', 160)}`, { file: path, line: lineAt(e.pos[0]) });
  }
  let data: unknown;
  try {
    data = doc.toJS({ maxAliasCount: 100 });
  } catch (e) {
    throw new InputError('bad-document', `${what} cannot be read: ${excerpt((e as Error).message, 160)}`, { file: path, line: 1 });
  }
  const validate = schemaValidator(schemaFile);
  if (!validate(data)) {
    const err = pickError(validate.errors ?? []);
    // an unknown key is located at the key itself, not at the object that holds it
    const extra = err.keyword === 'additionalProperties' ? String((err.params as { additionalProperty?: unknown }).additionalProperty) : undefined;
    const node = nodeAt(doc.contents as Node | null, err.instancePath, extra);
    const line = node?.range ? lineAt(node.range[0]) : 1;
    throw new InputError('invalid-document', `${what}: ${describeError(err)}`, { file: path, line });
  }
  return data as T;
}

/** The most specific error: the deepest path, preferring concrete keywords over anyOf summaries. */
function pickError(errors: ErrorObject[]): ErrorObject {
  const concrete = errors.filter((e) => e.keyword !== 'anyOf' && e.keyword !== 'oneOf');
  const pool = concrete.length ? concrete : errors;
  return pool.reduce((a, b) => (b.instancePath.length > a.instancePath.length ? b : a));
}

function describeError(e: ErrorObject): string {
  const where = e.instancePath ? `${e.instancePath.slice(1).replace(/\//g, '.')}` : 'the document';
  const p = e.params as Record<string, unknown>;
  switch (e.keyword) {
    case 'additionalProperties':
      return `${where} has an unknown key "${excerpt(String(p.additionalProperty))}"`;
    case 'required':
      return `${where} needs "${String(p.missingProperty)}"`;
    case 'enum':
      return `${where} must be one of ${(p.allowedValues as unknown[]).map(String).join(', ')}`;
    case 'type':
      return `${where} must be ${String(p.type)}`;
    default:
      return `${where} ${e.message ?? 'is invalid'}`;
  }
}

function nodeAt(root: Node | null, pointer: string, key?: string): Node | null {
  let node: Node | null = atPointer(root, pointer);
  if (key !== undefined && isMap(node)) {
    const pair = node.items.find((it) => String((it.key as { value?: unknown })?.value ?? it.key) === key);
    if (pair?.key) node = pair.key as Node;
  }
  return node;
}

function atPointer(root: Node | null, pointer: string): Node | null {
  let node: Node | null = root;
  for (const raw of pointer.split('/').slice(1)) {
    const key = raw.replace(/~1/g, '/').replace(/~0/g, '~');
    if (isMap(node)) {
      const pair = node.items.find((it) => String((it.key as { value?: unknown })?.value ?? it.key) === key);
      if (!pair) return node;
      node = (pair.value as Node | null) ?? (pair.key as Node);
    } else if (isSeq(node)) {
      const item = node.items[Number(key)] as Node | undefined;
      if (!item) return node;
      node = item;
    } else return node;
  }
  return node;
}
