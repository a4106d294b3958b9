/**
 * A writer of PostgreSQL's binary COPY format (PostgreSQL documentation, "COPY", section "Binary
 * Format"; the per-type layouts are those of the types' send functions: uuid_send, textsend,
 * int4send, date_send, array_send with float4send / float8send / int2send / boolsend / uuid_send).
 *
 * Hand-written rather than taken from pg-copy-streams-binary because that package builds one object
 * per value through a generic buffer builder (the season run writes about 75 million array elements
 * in a full run, so that cost is the run's) and has no uuid or date type. This writer fills one
 * growing Buffer with DataView writes and knows only the layouts the season run and the weather
 * intake need. `decodeArray` reads array_send's layout back (the intake reads stored years so).
 */

const SIGNATURE = Buffer.from('PGCOPY\n\xff\r\n\0', 'latin1');
const FLOAT4_OID = 700;
const FLOAT8_OID = 701;
const INT2_OID = 21;
const UUID_OID = 2950;
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

  /** A one-dimensional double precision[] of `values`; NaN becomes a NULL element (no value). */
  float8Array(values: ArrayLike<number>): this {
    const n = values.length;
    let nulls = 0;
    for (let i = 0; i < n; i++) if (values[i] !== values[i]) nulls++;
    const size = 20 + 12 * n - 8 * nulls;
    this.arrayHeader(size, nulls > 0, FLOAT8_OID, n);
    const v = this.view;
    let at = this.at;
    for (let i = 0; i < n; i++) {
      const x = values[i];
      if (x !== x) {
        v.setInt32(at, -1);
        at += 4;
      } else {
        v.setInt32(at, 8);
        v.setFloat64(at + 4, x);
        at += 12;
      }
    }
    this.at = at;
    return this;
  }

  /** A one-dimensional smallint[] of `values` (no NULL elements). */
  int2Array(values: ArrayLike<number>): this {
    const n = values.length;
    this.arrayHeader(20 + 6 * n, false, INT2_OID, n);
    const v = this.view;
    let at = this.at;
    for (let i = 0; i < n; i++) {
      v.setInt32(at, 2);
      v.setInt16(at + 4, values[i]);
      at += 6;
    }
    this.at = at;
    return this;
  }

  /** A one-dimensional uuid[] (no NULL elements). */
  uuidArray(ids: readonly string[]): this {
    const n = ids.length;
    this.arrayHeader(20 + 20 * n, false, UUID_OID, n);
    for (const id of ids) {
      const hex = id.replaceAll('-', '');
      if (hex.length !== 32) throw new RangeError(`not a uuid: ${id}`);
      this.view.setInt32(this.at, 16);
      this.buf.write(hex, this.at + 4, 'hex');
      this.at += 20;
    }
    return this;
  }

  /** The field length, then the array header of a one-dimensional array; room for `size` bytes is made. */
  private arrayHeader(size: number, hasNulls: boolean, oid: number, n: number): void {
    this.int32(size);
    this.ensure(size);
    const v = this.view;
    v.setInt32(this.at, 1); // dimensions
    v.setInt32(this.at + 4, hasNulls ? 1 : 0);
    v.setInt32(this.at + 8, oid);
    v.setInt32(this.at + 12, n); // length of the dimension
    v.setInt32(this.at + 16, 1); // lower bound
    this.at += 20;
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

  /** Bytes written since the start or the last `take()`. */
  get pending(): number {
    return this.at;
  }

  /**
   * The bytes written so far (the first part carries the signature); the writer goes on with an empty
   * buffer, so a long COPY can be sent in parts without holding all of it.
   */
  take(): Buffer {
    const part = this.buf.subarray(0, this.at);
    this.buf = Buffer.allocUnsafe(Math.max(1 << 16, this.buf.length));
    this.view = new DataView(this.buf.buffer, this.buf.byteOffset, this.buf.byteLength);
    this.at = 0;
    return part;
  }

  /** The bytes written so far, with the trailer that ends the COPY stream. The writer is spent afterwards. */
  finish(): Buffer {
    this.int16(-1);
    return this.buf.subarray(0, this.at);
  }
}

/**
 * A one-dimensional array in array_send's layout (what `array_send(col)` returns as bytea), read into
 * numbers and strings: float8 and int2 elements as numbers (a NULL element becomes NaN), uuid elements as strings.
 * An empty array reads as no elements.
 */
export function decodeArray(buf: Buffer): { oid: number; values: number[] | string[] } {
  const dims = buf.readInt32BE(0);
  const oid = buf.readInt32BE(8);
  if (dims === 0) return { oid, values: [] };
  if (dims !== 1) throw new RangeError(`a ${dims}-dimensional array`);
  const n = buf.readInt32BE(12);
  let at = 20;
  if (oid === UUID_OID) {
    const ids: string[] = new Array(n);
    for (let i = 0; i < n; i++) {
      const hex = buf.toString('hex', at + 4, at + 20);
      ids[i] = `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
      at += 20;
    }
    return { oid, values: ids };
  }
  const out: number[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const len = buf.readInt32BE(at);
    at += 4;
    if (len < 0) out[i] = Number.NaN;
    else {
      out[i] = oid === FLOAT8_OID ? buf.readDoubleBE(at) : oid === INT2_OID ? buf.readInt16BE(at) : oid === FLOAT4_OID ? buf.readFloatBE(at) : Number.NaN;
      at += len;
    }
  }
  return { oid, values: out };
}
