/**
 * Broodcast season-model command line: `npm run --silent model -- <command> [options]`.
 *
 * Prints JSON on stdout. A bad command, option or value prints ONE line on stderr naming it and exits
 * with code 2. `--batch` (single-value commands) reads one JSON object per stdin line, keys = option
 * names in camelCase; options given on the command line act as defaults for every line; each line's
 * result (or {"error": "..."}) is printed on its own line, in order, and the run exits 0.
 */
import { createInterface } from 'node:readline';
import { z } from 'zod';
import type { CliCommand } from './command';
import { commands } from './commands';
import { CliError } from './commands/cli-error';

const NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

const kebab = (camel: string): string => camel.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);
const camel = (kebabName: string): string => kebabName.replace(/-([a-z0-9])/g, (_, c: string) => c.toUpperCase());

/** The option keys of a command and which of them are numbers. */
function describe(cmd: CliCommand): { keys: string[]; numeric: Set<string> } {
  const schema = cmd.input as unknown;
  if (!(schema instanceof z.ZodObject)) return { keys: [], numeric: new Set() };
  const shape = schema.shape as Record<string, z.ZodType>;
  const numeric = new Set<string>();
  for (const [k, s] of Object.entries(shape)) {
    let inner: z.ZodType = s;
    while (inner instanceof z.ZodOptional || inner instanceof z.ZodDefault || inner instanceof z.ZodNullable) {
      inner = (inner as z.ZodOptional<z.ZodType>).unwrap();
    }
    if (inner instanceof z.ZodNumber) numeric.add(k);
  }
  return { keys: Object.keys(shape), numeric };
}

interface ParsedArgs {
  batch: boolean;
  values: Record<string, unknown>;
}

/** Parse `--name value`, `--name=value` and `--batch`. Values may start with "-" (negative numbers). */
function parseOptions(cmd: CliCommand, args: string[]): ParsedArgs {
  const { keys, numeric } = describe(cmd);
  const known = new Set(keys);
  const values: Record<string, unknown> = {};
  let batch = false;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (!arg.startsWith('--') || arg === '--') throw new CliError(`unexpected argument ${JSON.stringify(arg)} (options are --name value)`);
    const eq = arg.indexOf('=');
    const flag = eq >= 0 ? arg.slice(2, eq) : arg.slice(2);
    if (flag === 'batch') {
      if (eq >= 0) throw new CliError('--batch takes no value');
      batch = true;
      continue;
    }
    const key = camel(flag);
    if (!known.has(key) || kebab(key) !== flag) throw new CliError(`unknown option --${flag} for ${cmd.name} (options: ${keys.map((k) => `--${kebab(k)}`).join(', ')})`);
    if (key in values) throw new CliError(`--${flag} given more than once`);
    let raw: string;
    if (eq >= 0) raw = arg.slice(eq + 1);
    else {
      if (i + 1 >= args.length) throw new CliError(`--${flag}: missing value`);
      raw = args[++i];
    }
    values[key] = numeric.has(key) && NUMBER.test(raw.trim()) ? Number(raw) : raw;
  }
  return { batch, values };
}

/** One line naming the first problem: "--tmin: expected a temperature in °C (got "abc")". */
function formatIssues(error: z.ZodError, values: Record<string, unknown>, label: (key: string) => string): string {
  const issue = error.issues[0];
  if (issue.code === 'unrecognized_keys') return `unknown option ${issue.keys.map(label).join(', ')}`;
  const key = issue.path.length > 0 ? String(issue.path[0]) : '';
  const raw = key ? values[key] : undefined;
  const name = key ? label(key) : 'input';
  if (issue.message === 'is required') return `${name} is required`;
  const got = raw === undefined ? '' : ` (got ${JSON.stringify(raw)})`;
  return `${name}: ${issue.message}${got}`;
}

function validate(cmd: CliCommand, values: Record<string, unknown>, label: (key: string) => string): unknown {
  const r = cmd.input.safeParse(values);
  if (!r.success) throw new CliError(formatIssues(r.error, values, label));
  return r.data;
}

function runOne(cmd: CliCommand, input: unknown): unknown {
  try {
    return cmd.run!(input);
  } catch (e) {
    if (e instanceof RangeError) throw new CliError(e.message);
    throw e;
  }
}

function stdinLines(): AsyncIterable<string> {
  return createInterface({ input: process.stdin, crlfDelay: Infinity });
}

class Output {
  private buf: string[] = [];
  line(value: unknown): void {
    this.buf.push(JSON.stringify(value));
    if (this.buf.length >= 512) this.flush();
  }
  flush(): void {
    if (this.buf.length) process.stdout.write(this.buf.join('\n') + '\n');
    this.buf = [];
  }
}

async function runBatch(cmd: CliCommand, defaults: Record<string, unknown>, out: Output): Promise<void> {
  for await (const raw of stdinLines()) {
    const line = raw.trim();
    if (line === '') continue;
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      out.line({ error: 'line is not JSON' });
      continue;
    }
    if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed)) {
      out.line({ error: 'line is not a JSON object' });
      continue;
    }
    const values: Record<string, unknown> = { ...defaults, ...(parsed as Record<string, unknown>) };
    // Batch values are taken as typed in the JSON: a number must be a JSON number.
    try {
      out.line(runOne(cmd, validate(cmd, values, (k) => k)));
    } catch (e) {
      if (e instanceof CliError) out.line({ error: e.message });
      else throw e;
    }
  }
}

function usage(): unknown {
  return {
    usage: 'npm run --silent model -- <command> [--option value ...] [--batch]',
    commands: commands.map((c) => ({ name: c.name, summary: c.summary, options: describe(c).keys.map((k) => `--${kebab(k)}`), batch: c.run !== undefined })),
  };
}

async function main(argv: string[]): Promise<number> {
  const out = new Output();
  const [name, ...rest] = argv;
  try {
    if (name === undefined) throw new CliError(`missing command (one of: ${commands.map((c) => c.name).join(', ')}; or help)`);
    if (name === 'help' || name === '--help') {
      out.line(usage());
      out.flush();
      return 0;
    }
    const cmd = commands.find((c) => c.name === name);
    if (!cmd) throw new CliError(`unknown command ${JSON.stringify(name)} (one of: ${commands.map((c) => c.name).join(', ')})`);
    const { batch, values } = parseOptions(cmd, rest);
    if (batch) {
      if (!cmd.run) throw new CliError(`--batch is not available for ${cmd.name} (it reads its data from stdin)`);
      await runBatch(cmd, values, out);
    } else if (cmd.stream) {
      const input = validate(cmd, values, (k) => `--${kebab(k)}`);
      for await (const item of cmd.stream(input, stdinLines())) out.line(item);
    } else if (cmd.run) {
      out.line(runOne(cmd, validate(cmd, values, (k) => `--${kebab(k)}`)));
    } else {
      throw new CliError(`${cmd.name} has nothing to run`);
    }
    out.flush();
    return 0;
  } catch (e) {
    out.flush();
    if (e instanceof CliError) {
      process.stderr.write(`${e.message.replace(/\s*\n\s*/g, ' ')}\n`);
      return 2;
    }
    process.stderr.write(`internal error: ${e instanceof Error ? e.message : String(e)}`.replace(/\s*\n\s*/g, ' ') + '\n');
    return 1;
  }
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    console.error(err);
    process.exitCode = 1;
  },
);
