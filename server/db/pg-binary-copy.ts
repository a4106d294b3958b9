/**
 * A writer of PostgreSQL's binary COPY format (PostgreSQL documentation, "COPY", section "Binary
 * Format"; the per-type layouts are those of the types' send functions: uuid_send, textsend,
 * int4send, date_send, array_send with float4send / boolsend).
 *
 * Hand-written rather than taken from pg-copy-streams-binary because that package builds one object
 * per value through a generic buffer builder (the season run writes about 75 million array elements
 * in a full run, so that cost is the run's) and has no uuid or date type. This writer fills one
 * growing Buffer with DataView writes and knows only the five layouts the season run needs.
 */

const SIGNATURE = Buffer.from('PGCOPY\n\xff\r\n\0', 'latin1');
const FLOAT4_OID = 700;
const BOOL_OID = 16;
/** PostgreSQL dates count days from 2000-01-01; day numbers here count from 1970-01-01. */
const PG_EPOCH_DAY = 10957;

export class BinaryCopyWriter {
  private buf: Buffer;
  private view: DataView;
  private at = 0;

  constructor(initialBytes = 1 << 16) {
    this.buf = Buffer.allocUnsafe(initialBytes);
    this.view = new DataView(this.buf.buffer, this.buf.byteOffset, this.buf.byteLength);
    this.bytes(SIGNATURE);
    this.int32(0); // flags: no OIDs
    this.int32(0); // header extension length
  }

  private ensure(n: number): void {
    if (this.at + n <= this.buf.length) return;
    let size = this.buf.length * 2;
    while (size < this.at + n) size *= 2;
    const next = Buffer.allocUnsafe(size);
    this.buf.copy(next, 0, 0, this.at);
    this.buf = next;
    this.view = new DataView(next.buffer, next.byteOffset, next.byteLength);
  }

  private int16(x: number): void {
    this.ensure(2);
    this.view.setInt16(this.at, x);
    this.at += 2;
  }

  private int32(x: number): void {
    this.ensure(4);
    this.view.setInt32(this.at, x);
    this.at += 4;
  }

  private bytes(b: Uint8Array): void {
    this.ensure(b.length);
    this.buf.set(b, this.at);
    this.at += b.length;
  }

  /** Starts a tuple of `fields` fields. */
  row(fields: number): this {
    this.int16(fields);
    return this;
  }

  uuid(id: string): this {
    const hex = id.replaceAll('-', '');
    if (hex.length !== 32) throw new RangeError(`not a uuid: ${id}`);
    this.int32(16);
    this.ensure(16);
    this.buf.write(hex, this.at, 'hex');
    this.at += 16;
    return this;
  }

  text(s: string): this {
    const n = Buffer.byteLength(s);
    this.int32(n);
    this.ensure(n);
    this.buf.write(s, this.at, 'utf8');
    this.at += n;
    return this;
  }

  int4(x: number): this {
    this.int32(4);
    this.int32(x);
    return this;
  }

  /** A date given as days since 1970-01-01 (shared/model/dates.ts day numbers). */
  date(dayNumber: number): this {
    this.int32(4);
    this.int32(dayNumber - PG_EPOCH_DAY);
    return this;
  }

  /** A one-dimensional real[] of `values[from … from + n)`; NaN becomes a NULL element (unknown). */
  float4Array(values: ArrayLike<number>, from: number, n: number): this {
    let nulls = 0;
    for (let i = 0; i < n; i++) if (values[from + i] !== values[from + i]) nulls++;
    const size = 20 + 8 * n - 4 * nulls;
    this.int32(size);
    this.ensure(size);
    const v = this.view;
    let at = this.at;
    v.setInt32(at, 1); // dimensions
    v.setInt32(at + 4, nulls > 0 ? 1 : 0); // has nulls
    v.setInt32(at + 8, FLOAT4_OID);
    v.setInt32(at + 12, n); // length of the dimension
    v.setInt32(at + 16, 1); // lower bound
    at += 20;
    for (let i = 0; i < n; i++) {
      const x = values[from + i];
      if (x !== x) {
        v.setInt32(at, -1);
        at += 4;
      } else {
        v.setInt32(at, 4);
        v.setFloat32(at + 4, x);
        at += 8;
      }
    }
    this.at = at;
    return this;
  }

  /** A one-dimensional boolean[] of `values[from … from + n)` (non-zero is true). */
  boolArray(values: ArrayLike<number>, from: number, n: number): this {
    const size = 20 + 5 * n;
    this.int32(size);
    this.ensure(size);
    const v = this.view;
    let at = this.at;
    v.setInt32(at, 1);
    v.setInt32(at + 4, 0);
    v.setInt32(at + 8, BOOL_OID);
    v.setInt32(at + 12, n);
    v.setInt32(at + 16, 1);
    at += 20;
    for (let i = 0; i < n; i++) {
      v.setInt32(at, 1);
      v.setUint8(at + 4, values[from + i] ? 1 : 0);
      at += 5;
    }
    this.at = at;
    return this;
  }

  /** The whole COPY stream, with its trailer. The writer is spent afterwards. */
  finish(): Buffer {
    this.int16(-1);
    return this.buf.subarray(0, this.at);
  }
}
