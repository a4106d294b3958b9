import { createReadStream } from 'node:fs';
import { pipeline, type Readable, Transform } from 'node:stream';
import Papa from 'papaparse';
import { LIMITS } from '../../shared/limits';
import { capText } from '../http/limits';

/**
 * A failure that ends an intake, refusing the whole file: a stable code (the client words it), the
 * parameters it names, and an English message for the log and the API; nothing from the file is kept.
 */
export class IntakeFailure extends Error {
  constructor(readonly code: string, message: string, readonly params: Record<string, string | number> = {}) {
    super(capText(message));
  }
}

/**
 * The length of the current CSV record in bytes (a line break inside a quoted value belongs to the
 * record, as PapaParse reads it), over chunks, in one pass that jumps between quotes and line breaks
 * with Buffer.indexOf. Hand-written because no parser here bounds a record while it streams: PapaParse
 * re-reads an unfinished record from its start at every chunk, which is quadratic in the record's
 * length (a 60 MB value took 128 s), so a record past the limit must be refused before it reaches it.
 */
export class RecordBound {
  private len = 0;
  private inQuote = false;
  /** A closing-or-escaped quote was the last byte of the previous chunk. */
  private quoteAtEnd = false;
  /** The previous byte (to tell a quote opening a value from one inside a value). */
  private prev = 0x0a;
  /** Records begun so far (1-based number of the current record). */
  record = 1;

  constructor(private readonly max: number) {}

  /** Scan a chunk; returns false as soon as the current record is longer than the limit. */
  scan(buf: Buffer): boolean {
    return this.quick(buf) ?? this.exact(buf);
  }

  /**
   * The usual chunk (no quote, lines short) without visiting every line: a line longer than the limit
   * would hold a whole aligned block of half the limit without a line break, so one search per block
   * proves there is none. Undefined when that cannot be shown (then `exact` reads the chunk).
   */
  private quick(buf: Buffer): boolean | undefined {
    const n = buf.length;
    if (this.inQuote || this.quoteAtEnd || buf.indexOf(0x22) >= 0) return undefined;
    const first = buf.indexOf(0x0a);
    if (first < 0) {
      this.len += n;
      if (n > 0) this.prev = buf[n - 1];
      return this.len <= this.max;
    }
    if (this.len + first > this.max) return false;
    const half = Math.max(1, Math.floor(this.max / 2));
    for (let b = Math.ceil((first + 1) / half) * half; b + half <= n; b += half) {
      const nl = buf.indexOf(0x0a, b);
      if (nl < 0 || nl >= b + half) return undefined;
    }
    const last = buf.lastIndexOf(0x0a);
    if (n - 1 - last > this.max) return undefined;
    // Count the records, so a refusal names its line (a native search per line break).
    let breaks = 0;
    for (let i = first; i >= 0; i = buf.indexOf(0x0a, i + 1)) breaks++;
    this.record += breaks;
    this.len = n - 1 - last;
    this.prev = buf[n - 1];
    return true;
  }

  private exact(buf: Buffer): boolean {
    const n = buf.length;
    let pos = 0;
    if (this.quoteAtEnd && n > 0) {
      this.quoteAtEnd = false;
      if (buf[0] === 0x22) pos = 1; // an escaped quote: still inside the value
      else this.inQuote = false;
    }
    let nextQ = buf.indexOf(0x22, pos);
    let nextN = buf.indexOf(0x0a, pos);
    while (pos < n) {
      if (nextQ >= 0 && nextQ < pos) nextQ = buf.indexOf(0x22, pos);
      if (this.inQuote) {
        if (nextQ < 0) {
          this.len += n - pos;
          pos = n;
        } else if (nextQ + 1 === n) {
          this.len += n - pos;
          pos = n;
          this.quoteAtEnd = true;
        } else {
          const escaped = buf[nextQ + 1] === 0x22;
          if (!escaped) this.inQuote = false;
          this.len += nextQ + (escaped ? 2 : 1) - pos;
          pos = nextQ + (escaped ? 2 : 1);
        }
        continue;
      }
      if (nextN >= 0 && nextN < pos) nextN = buf.indexOf(0x0a, pos);
      if (nextN >= 0 && (nextQ < 0 || nextN < nextQ)) {
        this.len += nextN - pos;
        if (this.len > this.max) return false;
        this.len = 0;
        this.record++;
        pos = nextN + 1;
      } else if (nextQ >= 0) {
        const before = nextQ > 0 ? buf[nextQ - 1] : this.prev;
        // A quote opens a quoted value only at the start of a value; inside one it is a plain character.
        if (before === 0x2c || before === 0x0a || before === 0x0d) this.inQuote = true;
        this.len += nextQ + 1 - pos;
        pos = nextQ + 1;
      } else {
        this.len += n - pos;
        pos = n;
      }
    }
    if (n > 0) this.prev = buf[n - 1];
    return this.len <= this.max;
  }
}

/** Where the rows come from: a header record, then data records (arrays of fields in file order). */
export interface IntakeSource {
  /** Hands every record to `each`, in order, and resolves at the end; rejects with an IntakeFailure for a broken file. */
  read(each: (rec: string[]) => void): Promise<void>;
  /** Bytes read so far (for the progress bar), when the source is a file. */
  bytesRead?: () => number;
  /** Whether the source ended with a line break; a short last row without one means a cut-off file. */
  endedWithNewline?: () => boolean;
}


export const NOTHING_KEPT = 'Nothing from it was saved.';

/**
 * CSV text from a byte stream as records, through PapaParse's streaming parser (quoted fields, CRLF line
 * ends), which reads a national file about three times faster than csv-parse (docs/weather-intake.md
 * § Speed). The first bytes are checked for binary data, a byte-order mark is dropped, and bytes are
 * counted for the progress bar.
 */
export function csvStreamSource(input: Readable): IntakeSource {
  let bytes = 0;
  let last = -1;
  let first = true;
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const bound = new RecordBound(LIMITS.CSV_LINE_MAX_BYTES);
  const sniff = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      if (first) {
        first = false;
        const head = chunk.subarray(0, 64 * 1024);
        let text = true;
        try {
          decoder.decode(head, { stream: true });
        } catch {
          text = false;
        }
        if (!text || head.includes(0))
          return cb(new IntakeFailure('binary_file', `This is not a text CSV file (it holds binary data). ${NOTHING_KEPT} Save the sheet as CSV (UTF-8) and upload that.`));
        if (chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) chunk = chunk.subarray(3);
      }
      // The whole file, not only its start: a NUL byte anywhere means binary data (PostgreSQL text cannot hold one).
      if (chunk.indexOf(0) >= 0)
        return cb(new IntakeFailure('binary_file', `This is not a text CSV file (it holds binary data: a NUL byte near byte ${(bytes + chunk.indexOf(0)).toLocaleString('en')}). ${NOTHING_KEPT} Save the sheet as CSV (UTF-8) and upload that.`));
      if (!bound.scan(chunk))
        return cb(new IntakeFailure('line_too_long',
          `Line ${bound.record.toLocaleString('en')} of the file is longer than ${LIMITS.CSV_LINE_MAX_BYTES.toLocaleString('en')} bytes, the most Broodcast reads in one line. ${NOTHING_KEPT} Check that the file is a daily weather CSV with one row per line.`,
          { line: bound.record, limitBytes: LIMITS.CSV_LINE_MAX_BYTES }));
      bytes += chunk.length;
      if (chunk.length) last = chunk[chunk.length - 1];
      cb(null, chunk);
    },
  });
  return {
    bytesRead: () => bytes,
    endedWithNewline: () => last === 0x0a || last === 0x0d,
    read: (each) => new Promise<void>((resolve, reject) => {
      const text = pipeline(input, sniff, () => undefined);
      text.setEncoding('utf8'); // characters split across chunks are joined before the parser sees them
      let done = 0;
      let failed = false;
      const fail = (err: unknown) => {
        if (failed) return;
        failed = true;
        input.destroy();
        reject(err);
      };
      Papa.parse<string[]>(text as never, {
        delimiter: ',',
        skipEmptyLines: true,
        chunk(results, parser) {
          if (failed) return;
          try {
            const broken = results.errors.find((e) => e.type === 'Quotes');
            if (broken) throw csvProblem(broken, done);
            for (const rec of results.data) each(rec);
            done += results.data.length;
          } catch (err) {
            fail(err); // first: aborting calls `complete` at once
            parser.abort();
          }
        },
        complete: () => {
          if (!failed) resolve();
        },
        error: (err: unknown) => fail(err),
      });
    }),
  };
}

/** A CSV file written by multer as records. */
export const csvFileSource = (path: string): IntakeSource => csvStreamSource(createReadStream(path, { highWaterMark: 1 << 18 }));

/** Rows already in memory (the feed's JSON, a one-row correction) as records. */
export function recordsSource(header: string[], rows: string[][]): IntakeSource {
  return {
    read: async (each) => {
      each(header);
      for (const r of rows) each(r);
    },
    endedWithNewline: () => true,
  };
}

/** PapaParse's quote errors in the sender's words. */
function csvProblem(err: Papa.ParseError, recordsBefore: number): IntakeFailure {
  const line = recordsBefore + (err.row ?? 0) + 1;
  const where = ` near line ${line}`;
  if (err.code === 'MissingQuotes')
    return new IntakeFailure('truncated_file', `The file ends inside a quoted value${where}: it looks cut off. ${NOTHING_KEPT} Upload the complete file.`, { line });
  return new IntakeFailure('bad_csv', `The file is not valid CSV${where} (${err.message}). ${NOTHING_KEPT}`, { line });
}
