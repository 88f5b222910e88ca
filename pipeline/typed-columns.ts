// Growable typed columns and interned strings, for the species store (records.ts). A column grows in
// fixed chunks, so adding never copies what is already stored and never needs twice its size at once;
// 10^6 rows cost 8 bytes per number, not a JavaScript object per row.

const CHUNK_BITS = 14;
const CHUNK = 1 << CHUNK_BITS; // entries per chunk
const MASK = CHUNK - 1;

// F64Column and I32Column are written out twice on purpose: one generic class would make every get and
// set see two array kinds (a polymorphic access) on the hottest lines of the store.

/** A column of float64 values; NaN stands for "not given". */
export class F64Column {
  private readonly chunks: Float64Array[] = [];
  length = 0;

  push(v: number): number {
    const i = this.length++;
    if ((i & MASK) === 0) this.chunks.push(new Float64Array(CHUNK));
    this.chunks[i >>> CHUNK_BITS]![i & MASK] = v;
    return i;
  }

  get(i: number): number {
    return this.chunks[i >>> CHUNK_BITS]![i & MASK]!;
  }

  set(i: number, v: number): void {
    this.chunks[i >>> CHUNK_BITS]![i & MASK] = v;
  }
}

/** A column of 32-bit integers (indices, line numbers, ids); −1 stands for "none". */
export class I32Column {
  private readonly chunks: Int32Array[] = [];
  length = 0;

  push(v: number): number {
    const i = this.length++;
    if ((i & MASK) === 0) this.chunks.push(new Int32Array(CHUNK));
    this.chunks[i >>> CHUNK_BITS]![i & MASK] = v;
    return i;
  }

  get(i: number): number {
    return this.chunks[i >>> CHUNK_BITS]![i & MASK]!;
  }

  set(i: number, v: number): void {
    this.chunks[i >>> CHUNK_BITS]![i & MASK] = v;
  }
}

/** Distinct values by number: a table repeats a handful of files, sources and units on every row. */
export class Interned<T> {
  private readonly ids = new Map<T, number>();
  readonly values: T[] = [];

  private lastValue: T | undefined;
  private lastId = -1;

  id(v: T): number {
    if (this.lastId >= 0 && v === this.lastValue) return this.lastId; // rows mostly repeat the previous row's
    let id = this.ids.get(v);
    if (id === undefined) {
      id = this.values.length;
      this.values.push(v);
      this.ids.set(v, id);
    }
    this.lastValue = v;
    this.lastId = id;
    return id;
  }

  get(id: number): T {
    return this.values[id]!;
  }
}

/** An optional number as an F64Column keeps it: undefined becomes NaN. */
export const toCell = (v: number | undefined): number => (v === undefined ? NaN : v);
