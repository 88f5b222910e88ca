// The findings of a run, kept compactly. As objects a finding costs ~620 bytes of heap (the finding, its
// params and location, its rendered message); a table with a finding on every one of 10^6 rows needed
// ~1.4 GB. Here a finding is ten 4-byte numbers, its params as UTF-8 JSON in a byte pool and its
// species name in a name table (~100 bytes), and its message is rendered again from the rule's
// template when the finding is made into an object, which happens only as a writer reads it (`at`,
// iteration). The rare parts (a message that is not its template filled in, params JSON cannot carry,
// a line or column that is not a 32-bit integer, diagnosis, impact, waiver) are kept as they are, by index.
import { compareFindings } from './check.js';
import { NameTable } from './name-table.js';
import { renderTemplate, templateOf } from './rules/finding.js';
import { I32Column, Interned } from './typed-columns.js';
import type { Diagnosis, Finding, FindingList, Location, Severity } from './types.js';

/** Bytes per chunk of the params pool; params longer than this are kept as objects. */
const POOL_CHUNK = 1 << 20;

const int32 = (x: number): boolean => Number.isInteger(x) && x >= -0x80000000 && x <= 0x7fffffff && !Object.is(x, -0);

/** What JSON gives back exactly: finite numbers other than −0, strings, and keys that are not array indices. */
function jsonSafe(params: Record<string, number | string>): boolean {
  for (const k in params) {
    const v = params[k];
    if (typeof v === 'number' ? !Number.isFinite(v) || Object.is(v, -0) : typeof v !== 'string') return false;
    if (/^\d+$/.test(k)) return false; // JSON.parse would move an index-like key to the front
  }
  return true;
}

export class FindingStore implements FindingList {
  /** rule, severity and message id, interned together, with the message template the kind renders by */
  private readonly kind = new I32Column();
  private readonly kinds = new Interned<string>();
  private readonly kindParts: { rule: string; severity: Severity; messageId: string; template: string | undefined }[] = [];
  private readonly file = new I32Column();
  private readonly line = new I32Column();
  private readonly column = new I32Column(); // −1: none
  private readonly field = new I32Column(); // −1: none
  private readonly species = new I32Column(); // id in `names`, −1: none
  private readonly phase = new I32Column(); // −1: none
  private readonly paramsAt = new I32Column(); // byte offset in the pool, −1: kept as an object
  private readonly paramsBytes = new I32Column();
  private readonly texts = new Interned<string>(); // files, fields, phases
  private readonly names = new NameTable();
  private readonly pool: Buffer[] = [];
  private poolUsed = POOL_CHUNK; // bytes used in the last chunk (a full one: the first add opens a chunk)
  private readonly rare = {
    params: new Map<number, Record<string, number | string>>(),
    message: new Map<number, string>(),
    location: new Map<number, Location>(), // a line or column the columns cannot hold (not a 32-bit integer)
    diagnosis: new Map<number, Diagnosis>(),
    impact: new Map<number, NonNullable<Finding['impact']>>(),
    waived: new Map<number, NonNullable<Finding['waived']>>(),
  };
  /** after sort(): position -> index in input order */
  private order: Int32Array | undefined;

  get length(): number {
    return this.kind.length;
  }

  add(f: Finding): void {
    const i = this.kind.length;
    const k = this.kinds.id(`${f.rule}\u0000${f.severity}\u0000${f.messageId}`);
    if (k === this.kindParts.length) this.kindParts.push({ rule: f.rule, severity: f.severity, messageId: f.messageId, template: templateOf(f.rule, f.messageId) });
    this.kind.push(k);
    const loc = f.location;
    this.file.push(this.texts.id(loc.file));
    this.line.push(loc.line);
    this.column.push(loc.column ?? -1);
    this.field.push(loc.field === undefined ? -1 : this.texts.id(loc.field));
    if (!int32(loc.line) || (loc.column !== undefined && !(int32(loc.column) && loc.column >= 0))) this.rare.location.set(i, { ...loc });
    this.species.push(f.species === undefined ? -1 : this.names.id(f.species));
    this.phase.push(f.phase === undefined ? -1 : this.texts.id(f.phase));
    this.addParams(i, f.params);
    const template = this.kindParts[k]!.template;
    if (template === undefined || renderTemplate(template, f.params) !== f.message) this.rare.message.set(i, f.message);
    if (f.diagnosis) this.rare.diagnosis.set(i, f.diagnosis);
    if (f.impact) this.rare.impact.set(i, f.impact);
    if (f.waived) this.rare.waived.set(i, f.waived);
    this.order = undefined;
  }

  private addParams(i: number, params: Record<string, number | string>): void {
    const text = jsonSafe(params) ? JSON.stringify(params) : undefined;
    const n = text === undefined ? POOL_CHUNK + 1 : Buffer.byteLength(text);
    // too long for a chunk, or past what a 32-bit offset reaches (2 GB of params: tens of millions of findings)
    if (n > POOL_CHUNK || this.pool.length * POOL_CHUNK >= 0x7fffffff - POOL_CHUNK) {
      this.rare.params.set(i, params);
      this.paramsAt.push(-1);
      this.paramsBytes.push(0);
      return;
    }
    if (this.poolUsed + n > POOL_CHUNK) {
      this.pool.push(Buffer.allocUnsafe(POOL_CHUNK));
      this.poolUsed = 0;
    }
    this.pool[this.pool.length - 1]!.write(text!, this.poolUsed, 'utf8');
    this.paramsAt.push((this.pool.length - 1) * POOL_CHUNK + this.poolUsed);
    this.paramsBytes.push(n);
    this.poolUsed += n;
  }

  private params(i: number): Record<string, number | string> {
    const at = this.paramsAt.get(i);
    if (at < 0) return this.rare.params.get(i)!;
    const offset = at % POOL_CHUNK;
    return JSON.parse(this.pool[Math.floor(at / POOL_CHUNK)]!.toString('utf8', offset, offset + this.paramsBytes.get(i))) as Record<string, number | string>;
  }

  /** Finding i in input order, as an object made afresh (keys in the order makeFinding gives them). */
  private make(i: number): Finding {
    const { rule, severity, messageId, template } = this.kindParts[this.kind.get(i)]!;
    let location = this.rare.location.get(i);
    if (location) location = { ...location };
    else {
      location = { file: this.texts.get(this.file.get(i)), line: this.line.get(i) };
      const column = this.column.get(i);
      if (column >= 0) location.column = column;
      const field = this.field.get(i);
      if (field >= 0) location.field = this.texts.get(field);
    }
    const f: Finding = { rule, severity, messageId, params: this.params(i), message: '', location };
    const species = this.species.get(i);
    if (species >= 0) f.species = this.names.name(species);
    const phase = this.phase.get(i);
    if (phase >= 0) f.phase = this.texts.get(phase);
    f.message = this.rare.message.get(i) ?? renderTemplate(template!, f.params);
    const diagnosis = this.rare.diagnosis.get(i);
    if (diagnosis) f.diagnosis = diagnosis;
    const impact = this.rare.impact.get(i);
    if (impact) f.impact = impact;
    const waived = this.rare.waived.get(i);
    if (waived) f.waived = waived;
    return f;
  }

  private index(position: number): number {
    return this.order ? this.order[position]! : position;
  }

  /** The finding at `position` (input order, or sorted order after sort()). */
  at(position: number): Finding {
    return this.make(this.index(position));
  }

  /** Rule, species and phase at `position`, without making the finding. */
  rule(position: number): string {
    return this.kindParts[this.kind.get(this.index(position))]!.rule;
  }

  speciesKey(position: number): string | undefined {
    const i = this.index(position);
    const s = this.species.get(i);
    const p = this.phase.get(i);
    return s < 0 || p < 0 ? undefined : `${this.names.name(s)}|${this.texts.get(p)}`;
  }

  /** Severity and waiver of each finding, without making the findings: what a summary counts. */
  *severities(): Iterable<Pick<Finding, 'severity' | 'waived'>> {
    for (let i = 0; i < this.length; i++) yield { severity: this.kindParts[this.kind.get(i)]!.severity, waived: this.rare.waived.get(i) };
  }

  setImpact(position: number, impact: NonNullable<Finding['impact']>): void {
    this.rare.impact.set(this.index(position), impact);
  }

  /** Orders the findings as compareFindings does (file, line, column, rule, message), ties in input order. */
  sort(): void {
    const n = this.length;
    const fileOf = (i: number): string => this.texts.get(this.file.get(i));
    const ruleOf = (i: number): string => this.kindParts[this.kind.get(i)]!.rule;
    const order = new Int32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
    const odd = this.rare.location;
    order.sort((a, b) => {
      if (odd.size > 0 && (odd.has(a) || odd.has(b))) return compareFindings(this.make(a), this.make(b)) || a - b;
      if (this.file.get(a) !== this.file.get(b)) {
        const fa = fileOf(a);
        const fb = fileOf(b);
        if (fa !== fb) return fa < fb ? -1 : 1;
      }
      const dl = this.line.get(a) - this.line.get(b);
      if (dl !== 0) return dl;
      const dc = Math.max(0, this.column.get(a)) - Math.max(0, this.column.get(b));
      if (dc !== 0) return dc;
      const ra = ruleOf(a);
      const rb = ruleOf(b);
      if (ra !== rb) return ra < rb ? -1 : 1;
      return compareFindings(this.make(a), this.make(b)) || a - b;
    });
    this.order = order;
  }

  *[Symbol.iterator](): Iterator<Finding> {
    for (let p = 0; p < this.length; p++) yield this.at(p);
  }
}
