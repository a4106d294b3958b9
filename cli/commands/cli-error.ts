/** An error in the user's input (bad option, value or data line): one stderr line, exit code 2. */
export class CliError extends Error {
  override name = 'CliError';
}
