// Look at a file before parsing it: present, a regular file, not empty, UTF-8 text.
import { closeSync, openSync, readSync, statSync } from 'node:fs';
import { InputError } from '../errors.js';

const SNIFF_BYTES = 64 * 1024;

/** Throws InputError (exit 2) when the file cannot be a UTF-8 table; returns its size in bytes. */
export function sniff(path: string): number {
  let size: number;
  try {
    const st = statSync(path);
    if (st.isDirectory()) throw new InputError('not-a-file', 'is a directory, not a file', { file: path });
    size = st.size;
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? 'missing-file' : 'unreadable-file', code === 'ENOENT' ? 'no such file' : `cannot be read (${code ?? 'error'})`, { file: path });
  }
  const buf = Buffer.alloc(Math.min(SNIFF_BYTES, size));
  let n = 0;
  try {
    const fd = openSync(path, 'r');
    try {
      n = readSync(fd, buf, 0, buf.length, 0);
    } finally {
      closeSync(fd);
    }
  } catch (e) {
    throw new InputError('unreadable-file', `cannot be read (${(e as NodeJS.ErrnoException).code ?? 'error'})`, { file: path });
  }
  const head = buf.subarray(0, n);
  if (head.toString('utf8').replace(/^\uFEFF/, '').trim() === '' && size <= SNIFF_BYTES) {
    throw new InputError('empty-file', 'the file is empty', { file: path, line: 1 });
  }
  if ((head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff)) {
    throw new InputError('not-utf8', 'the file is UTF-16; save it as UTF-8', { file: path, line: 1 });
  }
  const nul = head.indexOf(0);
  if (nul !== -1) {
    throw new InputError('binary-file', 'the file holds NUL bytes: it is binary or UTF-16, not a UTF-8 text table', { file: path, line: lineAt(head, nul) });
  }
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(head, { stream: true });
  } catch {
    const bad = firstInvalidUtf8(head);
    throw new InputError('not-utf8', 'the file is not valid UTF-8 text (binary data or another encoding)', { file: path, line: lineAt(head, bad) });
  }
  return size;
}

function lineAt(buf: Buffer, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < buf.length; i++) if (buf[i] === 0x0a) line++;
  return line;
}

function firstInvalidUtf8(buf: Buffer): number {
  const dec = new TextDecoder('utf-8', { fatal: true });
  let lo = 0;
  let hi = buf.length;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    try {
      dec.decode(buf.subarray(0, mid), { stream: true });
      lo = mid;
    } catch {
      hi = mid;
    }
  }
  return lo;
}
