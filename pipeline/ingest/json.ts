// JSON arrays of objects and NDJSON (one object per line). Each record keeps the line where it starts.
import { createReadStream, readFileSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { InputError, excerpt } from '../errors.js';
import { LIMITS, type TableSink } from './events.js';
import { sniff } from './sniff.js';

/** Turns JSON objects into positional cells, growing the header as new keys appear. */
class RecordShaper {
  private keys = new Map<string, number>();
  private header: string[] = [];
  constructor(private sink: TableSink) {}

  emit(value: unknown, line: number): void {
    if (value === null || typeof value !== 'object' || Array.isArray(value)) {
      const detail = value === null ? 'null' : Array.isArray(value) ? 'an array' : `a ${typeof value}`;
      this.sink({ type: 'unreadable', line, messageId: 'notObject', params: { detail } });
      return;
    }
    const obj = value as Record<string, unknown>;
    let grew = false;
    for (const k of Object.keys(obj)) {
      if (!this.keys.has(k)) {
        if (this.header.length >= LIMITS.maxColumns) {
          throw new InputError('too-many-columns', `records use more than ${LIMITS.maxColumns} distinct keys`, { line });
        }
        this.keys.set(k, this.header.length);
        this.header.push(k);
        grew = true;
      }
    }
    if (grew) this.sink({ type: 'header', cells: [...this.header], line });
    const cells: (string | undefined)[] = new Array(this.header.length);
    for (const [k, v] of Object.entries(obj)) {
      const text = cellText(v);
      if (text === false) {
        const expected = 'a number, a string, or an array of numbers';
        this.sink({ type: 'unreadable', line, messageId: 'type', params: { field: excerpt(k), detail: describe(v), expected } });
        return;
      }
      cells[this.keys.get(k)!] = text;
    }
    this.sink({ type: 'row', cells, line });
  }

  get seen(): boolean {
    return this.header.length > 0;
  }
}

/** A JSON value as the text a CSV cell would hold; false when the type cannot be a cell. */
function cellText(v: unknown): string | undefined | false {
  if (v === null || v === undefined) return undefined;
  if (typeof v === 'string') return v;
  if (typeof v === 'number') return String(v);
  if (Array.isArray(v)) {
    if (v.every((x) => typeof x === 'number' || typeof x === 'string')) return v.map(String).join(' ');
    return false;
  }
  return false;
}

function describe(v: unknown): string {
  if (Array.isArray(v)) return 'an array with non-numeric items';
  if (typeof v === 'object') return 'an object';
  return `a ${typeof v} (${excerpt(String(v), 20)})`;
}

/** Parse with a depth bound, so deeply nested input is refused rather than exhausting the stack. */
function parseBounded(text: string): { value?: unknown; error?: string } {
  let depth = 0;
  let max = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 92) i++;
      else if (c === 34) inString = false;
    } else if (c === 34) inString = true;
    else if (c === 91 || c === 123) max = Math.max(max, ++depth);
    else if (c === 93 || c === 125) depth--;
  }
  if (max > LIMITS.maxJsonDepth) return { error: `nested deeper than ${LIMITS.maxJsonDepth} levels` };
  try {
    return { value: JSON.parse(text) };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

export async function readJsonArray(path: string, sink: TableSink): Promise<void> {
  const size = sniff(path);
  if (size > LIMITS.maxJsonBytes) {
    throw new InputError('file-too-large', `a JSON array file is read whole and this one has ${size} bytes (limit ${LIMITS.maxJsonBytes}); write it as NDJSON or CSV`, { file: path });
  }
  const text = readFileSync(path, 'utf8').replace(/^\uFEFF/, '');
  const shaper = new RecordShaper(sink);
  // Scan the top-level array for the start and end of each element, tracking strings and depth.
  let i = 0;
  let line = 1;
  const skipSpace = (): void => {
    while (i < text.length) {
      const c = text.charCodeAt(i);
      if (c === 10) line++;
      else if (c !== 32 && c !== 9 && c !== 13) break;
      i++;
    }
  };
  skipSpace();
  if (text[i] !== '[') {
    throw new InputError('not-an-array', 'a JSON table must be an array of objects, one per row ([{...}, {...}])', { file: path, line });
  }
  i++;
  for (;;) {
    skipSpace();
    if (i >= text.length) throw new InputError('bad-json', 'the JSON array is never closed', { file: path, line });
    if (text[i] === ']') break;
    const start = i;
    const startLine = line;
    let depth = 0;
    let inString = false;
    for (; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c === 10) line++;
      if (inString) {
        if (c === 92) i++;
        else if (c === 34) inString = false;
      } else if (c === 34) inString = true;
      else if (c === 91 || c === 123) depth++;
      else if (c === 93 || c === 125) {
        if (depth === 0) {
          if (c === 93) break; // the array's own closing bracket
          continue; // a stray '}' stays in this record, which then fails to parse (breaking here would loop forever)
        }
        depth--;
      } else if (c === 44 && depth === 0) break;
    }
    if (i >= text.length) throw new InputError('bad-json', `the JSON array is never closed (the record starting at line ${startLine} runs to the end of the file)`, { file: path, line: startLine });
    const slice = text.slice(start, i);
    if (slice.length > LIMITS.maxRecordChars) {
      sink({ type: 'unreadable', line: startLine, messageId: 'json', params: { detail: `record longer than ${LIMITS.maxRecordChars} characters` } });
    } else {
      const parsed = parseBounded(slice);
      if (parsed.error !== undefined) sink({ type: 'unreadable', line: startLine, messageId: 'json', params: { detail: excerpt(parsed.error, 120) } });
      else shaper.emit(parsed.value, startLine);
    }
    if (text[i] === ',') i++;
  }
  i++;
  skipSpace();
  if (i < text.length) throw new InputError('bad-json', 'text follows the closing bracket of the JSON array', { file: path, line });
  if (!shaper.seen) sink({ type: 'header', cells: [], line: 1 });
}

export async function readNdjson(path: string, sink: TableSink): Promise<void> {
  sniff(path);
  const shaper = new RecordShaper(sink);
  const input = createReadStream(path, { encoding: 'utf8' });
  const lines = createInterface({ input, crlfDelay: Infinity });
  let line = 0;
  try {
    for await (const raw of lines) {
      line++;
      const text = line === 1 ? raw.replace(/^\uFEFF/, '') : raw;
      if (text.trim() === '') continue;
      if (text.length > LIMITS.maxRecordChars) {
        sink({ type: 'unreadable', line, messageId: 'json', params: { detail: `line longer than ${LIMITS.maxRecordChars} characters` } });
        continue;
      }
      const parsed = parseBounded(text);
      if (parsed.error !== undefined) sink({ type: 'unreadable', line, messageId: 'json', params: { detail: excerpt(parsed.error, 120) } });
      else shaper.emit(parsed.value, line);
    }
  } catch (e) {
    if (e instanceof InputError) throw new InputError(e.code, e.message, { file: path, line: e.line ?? line });
    throw new InputError('unreadable-file', `cannot be read: ${(e as Error).message}`, { file: path, line });
  } finally {
    input.destroy();
  }
  if (!shaper.seen) sink({ type: 'header', cells: [], line: 1 });
}
