import { createReadStream } from 'node:fs';
import { pipeline, type Readable, Transform } from 'node:stream';
import Papa from 'papaparse';

/** A failure that ends an intake with a message for the person who sent it; nothing from it is kept. */
export class IntakeFailure extends Error {
  constructor(readonly code: string, message: string) {
    super(message);
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
  const where = ` near line ${recordsBefore + (err.row ?? 0) + 1}`;
  if (err.code === 'MissingQuotes')
    return new IntakeFailure('truncated_file', `The file ends inside a quoted value${where}: it looks cut off. ${NOTHING_KEPT} Upload the complete file.`);
  return new IntakeFailure('bad_csv', `The file is not valid CSV${where} (${err.message}). ${NOTHING_KEPT}`);
}
