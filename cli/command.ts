import type { ZodType } from 'zod';

/**
 * One command of the `npm run --silent model -- <command>` line.
 *
 * `input` is the zod schema of the command's options in camelCase (the same keys a `--batch` line
 * carries); the CLI maps `--tmin-next` to `tminNext` and coerces numbers before it validates.
 * `run` is pure: it takes the parsed input and returns the JSON-serialisable result.
 * Commands that read a whole CSV stream (like `season`) set `stream` instead of `run`.
 */
export interface CliCommand<I = any> {
  name: string;
  summary: string;
  input: ZodType<I>;
  run?: (input: I) => unknown;
  /** For commands that read stdin as their data (not `--batch`): yields one JSON object per output line. */
  stream?: (input: I, lines: AsyncIterable<string>) => AsyncIterable<unknown>;
}
