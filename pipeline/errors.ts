// Input that cannot be used as a whole (exit code 2). Row-level problems are findings instead.

export class InputError extends Error {
  readonly code: string;
  readonly file?: string;
  readonly line?: number;
  readonly field?: string;

  constructor(code: string, message: string, where: { file?: string; line?: number; field?: string } = {}) {
    super(message);
    this.name = 'InputError';
    this.code = code;
    this.file = where.file;
    this.line = where.line;
    this.field = where.field;
  }

  /** `file:line: message (field …)`, the one line a user sees. */
  describe(): string {
    // the file name and field come from the user's input (a manifest, a header): never print them raw
    const at = this.file ? `${excerpt(this.file, Infinity)}${this.line ? `:${this.line}` : ''}: ` : '';
    const field = this.field ? ` [field ${excerpt(this.field, 120)}]` : '';
    return `${at}${this.message}${field}`;
  }
}

/** Printable, bounded excerpt of untrusted text for messages: control characters escaped, long text cut. */
export function excerpt(text: string, max = 60): string {
  const cut = text.length > max ? text.slice(0, max) + '…' : text;
  return cut.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g, (c) =>
    c === '\n' ? '\\n' : c === '\r' ? '\\r' : c === '\t' ? '\\t' : `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
}
