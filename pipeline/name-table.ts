// Species names for the species store: each distinct name once, as UTF-16 code units in one typed
// pool, found again through an open-addressing hash index. 10^6 rows bring ~6·10^5 names; as
// JavaScript strings in a Map they cost ~75 MB of heap that the collector walks on every full
// collection (and sizes the heap by), here ~25 MB of typed arrays it never walks. Comparing code
// units orders names exactly as JavaScript's `<` on strings does.
import { endianness } from 'node:os';
import { I32Column } from './typed-columns.js';

/** A Uint16Array is in the machine's byte order; Node reads 'utf16le' text from little-endian bytes. */
const LITTLE_ENDIAN = endianness() === 'LE';

/** FNV-1a over the code units, as a 32-bit integer. */
function hashOf(s: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x01000193);
  return h | 0;
}

export class NameTable {
  private units = new Uint16Array(1 << 12);
  private used = 0;
  private readonly start = new I32Column();
  private readonly length = new I32Column();
  private readonly hash = new I32Column();
  /** name id + 1 per slot, 0 for an empty slot; kept at most 70 % full */
  private slots = new Int32Array(1 << 10);

  get size(): number {
    return this.start.length;
  }

  /** The id of this name, or −1. */
  find(name: string): number {
    const h = hashOf(name);
    const mask = this.slots.length - 1;
    for (let p = h & mask; ; p = (p + 1) & mask) {
      const e = this.slots[p]!;
      if (e === 0) return -1;
      if (this.hash.get(e - 1) === h && this.equals(e - 1, name)) return e - 1;
    }
  }

  /** The id of this name, added when new. */
  id(name: string): number {
    const found = this.find(name);
    if (found >= 0) return found;
    const id = this.start.length;
    if (this.used + name.length > this.units.length) {
      let size = this.units.length * 2;
      while (size < this.used + name.length) size *= 2;
      const grown = new Uint16Array(size);
      grown.set(this.units.subarray(0, this.used));
      this.units = grown;
    }
    for (let i = 0; i < name.length; i++) this.units[this.used + i] = name.charCodeAt(i);
    this.start.push(this.used);
    this.length.push(name.length);
    this.hash.push(hashOf(name));
    this.used += name.length;
    if ((id + 1) * 10 > this.slots.length * 7) this.rehash(this.slots.length * 2);
    else this.place(id);
    return id;
  }

  /** The name as a string (a new string on every call). */
  name(id: number): string {
    const s = this.start.get(id);
    const n = this.length.get(id);
    if (LITTLE_ENDIAN) return Buffer.from(this.units.buffer, this.units.byteOffset + 2 * s, 2 * n).toString('utf16le'); // code units as they are, lone surrogates too
    let out = '';
    for (let k = 0; k < n; k++) out += String.fromCharCode(this.units[s + k]!);
    return out;
  }

  /** Orders two names as `<` orders their strings. */
  compare(a: number, b: number): number {
    if (a === b) return 0;
    const sa = this.start.get(a);
    const sb = this.start.get(b);
    const na = this.length.get(a);
    const nb = this.length.get(b);
    const n = Math.min(na, nb);
    for (let k = 0; k < n; k++) {
      const d = this.units[sa + k]! - this.units[sb + k]!;
      if (d !== 0) return d;
    }
    return na - nb;
  }

  private equals(id: number, name: string): boolean {
    if (this.length.get(id) !== name.length) return false;
    const s = this.start.get(id);
    for (let k = 0; k < name.length; k++) if (this.units[s + k] !== name.charCodeAt(k)) return false;
    return true;
  }

  private place(id: number): void {
    const mask = this.slots.length - 1;
    let p = this.hash.get(id) & mask;
    while (this.slots[p] !== 0) p = (p + 1) & mask;
    this.slots[p] = id + 1;
  }

  private rehash(size: number): void {
    this.slots = new Int32Array(size);
    for (let id = 0; id < this.start.length; id++) this.place(id);
  }
}
