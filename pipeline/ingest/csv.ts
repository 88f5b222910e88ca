// CSV and TSV through csv-parse, streaming, no per-cell cast. Every record keeps its physical start line.
import { createReadStream } from 'node:fs';
import { Parser, type CsvError } from 'csv-parse';
import { InputError, excerpt } from '../errors.js';
import { LIMITS, type TableSink } from './events.js';
import { sniff } from './sniff.js';

/**
 * Streams the table at `path` into `sink`. Lines are counted here rather than taken from the parser:
 * a record starts on the line after the previous one ended, and spans one line more than the number of
 * line feeds inside its quoted fields. Empty lines and lines starting with `#` (outside quotes) give no
 * record; the parser counts them, and they are added in.
 */
export async function readDelimited(path: string, delimiter: ',' | '\t', sink: TableSink): Promise<void> {
  sniff(path);
  const parser = new LineCountingParser({
    delimiter,
    bom: true,
    relax_column_count: true, // ragged rows become row findings, not a failed file
    relax_quotes: true, // a stray quote inside a field stays in the field (and fails its number check)
    max_record_size: LIMITS.maxRecordChars,
    // a comment is a line that starts with `#` outside quotes, read by the lexer: a quote inside it opens
    // nothing (`# see,"note` must not swallow the rows after it), and a quoted "#1" cell is data
    comment: '#',
    comment_no_infix: true,
    // csv-parse takes the width of its first record as the expected one and builds an error object
    // (stack trace, deep copy of the record) for every record of another width, even when relaxed; so
    // comment and empty lines must give no record at all (a blank line before the header would make
    // every row such a record). Both are still lines: the parser counts them.
    skip_empty_lines: true,
  });
  let consumed = 0; // lines taken by the records seen so far
  let headerSeen = false;
  let width = 0;
  let header: string[] = [];
  let nextLine = 1; // where the next record starts at the earliest, for errors raised by the parser
  const onRecord = (record: string[], skipped: number): void => {
    const line = 1 + consumed + skipped;
    let feeds = 0;
    for (let i = 0; i < record.length; i++) {
      const cell = record[i]!;
      if (cell.length > 0 && cell.indexOf('\n') !== -1) feeds += countFeeds(cell);
    }
    consumed += 1 + feeds;
    nextLine = 1 + consumed + skipped;
    if (record.length === 1 && record[0]!.trim() === '') return; // blank line
    if (!headerSeen) {
      headerSeen = true;
      width = record.length;
      if (width > LIMITS.maxColumns) {
        throw new InputError('too-many-columns', `the header has ${width} columns; thermovet reads at most ${LIMITS.maxColumns}`, { file: path, line });
      }
      if (width === 1) {
        const other = [';', '\t', ',', '|'].find((d) => d !== delimiter && record[0]!.includes(d));
        if (other) {
          const name = other === '\t' ? 'a tab' : `"${other}"`;
          throw new InputError('wrong-delimiter', `the header is one column; the file looks delimited by ${name}, not by ${delimiter === '\t' ? 'tabs' : 'commas'} (use --format or rename the file)`, { file: path, line });
        }
      }
      header = record;
      sink({ type: 'header', cells: record, line });
      return;
    }
    if (record.length !== width) {
      // where the row and the header part: the first header column left without a value, or the first field beyond the header
      const short = record.length < width;
      const column = short ? record.length + 1 : width + 1;
      const field = short ? excerpt(header[record.length]!.trim()) : undefined;
      const params = { found: record.length, expected: width, column, ...(field !== undefined ? { field } : {}) };
      sink({ type: 'unreadable', line, messageId: short ? 'ragged' : 'raggedLong', params, column, ...(field !== undefined ? { field } : {}) });
      return;
    }
    sink({ type: 'row', cells: record, line });
  };

  await new Promise<void>((resolve, reject) => {
    const input = createReadStream(path);
    const fail = (e: unknown): void => {
      input.destroy();
      parser.destroy();
      reject(e instanceof InputError ? e : csvProblem(e as CsvError, path, nextLine));
    };
    input.on('error', fail);
    parser.on('error', fail);
    parser.on('data', (record: string[]) => {
      try {
        onRecord(record, parser.skippedBefore.shift()!);
      } catch (e) {
        fail(e);
      }
    });
    parser.on('end', resolve);
    input.pipe(parser);
  });
  if (!headerSeen) throw new InputError('empty-file', 'the file has no header and no rows', { file: path, line: 1 });
}

/**
 * csv-parse with the number of comment and empty lines skipped before each record. Its `info` option
 * gives that too, but builds two objects of a dozen fields per record (~40 % of the parser's own time);
 * here the counts are read from the parser's live counters when it hands the record over, and queued
 * until the record comes out of the stream.
 */
class LineCountingParser extends Parser {
  readonly skippedBefore: number[] = [];
  override push(chunk: unknown, encoding?: BufferEncoding): boolean {
    if (chunk !== null) this.skippedBefore.push(this.info.comment_lines + this.info.empty_lines);
    return super.push(chunk, encoding);
  }
}

function countFeeds(s: string): number {
  let n = 0;
  for (let i = s.indexOf('\n'); i !== -1; i = s.indexOf('\n', i + 1)) n++;
  return n;
}

function csvProblem(e: CsvError | NodeJS.ErrnoException, file: string, line: number): InputError {
  const code = (e as { code?: string }).code ?? '';
  if (code === 'CSV_QUOTE_NOT_CLOSED') {
    return new InputError('unterminated-quote', `a quoted field opened on or after line ${line} is never closed; every row after it would be lost, so the file is not read`, { file, line });
  }
  if (code === 'CSV_MAX_RECORD_SIZE') {
    return new InputError('record-too-large', `a record starting at line ${line} exceeds ${LIMITS.maxRecordChars} characters (a runaway quote or a corrupted file?)`, { file, line });
  }
  if (code === 'EISDIR') return new InputError('not-a-file', 'is a directory, not a table file', { file });
  if (code === 'ENOENT') return new InputError('missing-file', 'no such file', { file });
  if (code === 'EACCES') return new InputError('unreadable-file', 'permission denied', { file });
  return new InputError('unreadable-file', `cannot be read as CSV near line ${line}: ${e.message}`, { file, line });
}
