/**
 * The `calc` command's core, independent of where its commands come from: argument checks, reading the request,
 * schema validation, running the command and the exit code. It imports no command, no schema and no zod, so the
 * launcher (server/cli/calc.mjs) can answer `--help` or an unknown command without loading any of them, and load only
 * the bundle of the one command asked for (docs/decisions/0013-calc-start-up.md).
 * Exit 0 with the answer on stdout; exit 2 with `{ "error": { code, message, issues } }` as the last line of stderr
 * for bad input (unknown command, unreadable file, invalid JSON, a request the schema or the mathematics refuses);
 * exit 1 for an internal failure. The same commands and schemas serve POST /api/compute/<command>.
 */
import { readFileSync, readSync } from 'node:fs';
import { resolve } from 'node:path';
import { ComputeInputError, errorCodes, type ComputeCommand } from '../../shared/compute/types';
import type { ApiErrorBody, ApiIssue } from '../../shared/contracts/errors';
import type { ZodError } from 'zod';

export interface CalcIo {
  readStdin(): string;
  readFile(path: string): string;
  stdout(text: string): void;
  stderr(text: string): void;
}

/** A command ready to run, with the converter of its schema errors (both from the command's own bundle). */
export interface LoadedCommand {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- commands of every request type
  command: ComputeCommand<any, any>;
  toApiIssues(error: ZodError): ApiIssue[];
}

/** What calc can run: every command's one-line summary, and the command itself on demand. */
export interface CommandCatalogue {
  summaries: Readonly<Record<string, string>>;
  load(name: string): LoadedCommand;
}

/**
 * All of standard input, synchronously. `readFileSync(0)` fails with EAGAIN when a large request arrives through a
 * non-blocking pipe, so read in chunks and wait briefly whenever the pipe is momentarily empty.
 */
export function readStandardInput(): string {
  const chunks: Buffer[] = [];
  const buffer = Buffer.alloc(1 << 16);
  const pause = new Int32Array(new SharedArrayBuffer(4));
  for (;;) {
    let count: number;
    try {
      count = readSync(0, buffer, 0, buffer.length, null);
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      if (code === 'EAGAIN') {
        Atomics.wait(pause, 0, 0, 5);
        continue;
      }
      if (code === 'EOF') break;
      throw error;
    }
    if (count === 0) break;
    chunks.push(Buffer.from(buffer.subarray(0, count)));
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** Standard streams and files; relative paths are resolved against `baseDirectory`. */
export function createIo(baseDirectory: string = process.cwd()): CalcIo {
  return {
    readStdin: readStandardInput,
    readFile: (path) => readFileSync(resolve(baseDirectory, path), 'utf8'),
    stdout: (text) => process.stdout.write(text),
    stderr: (text) => process.stderr.write(text),
  };
}

function commandNames(catalogue: CommandCatalogue): string[] {
  return Object.keys(catalogue.summaries).sort();
}

export function usageOf(catalogue: CommandCatalogue): string {
  const lines = [
    'Usage: npm run --silent calc -- <command> <request.json | ->',
    '   or: node server/cli/calc.mjs <command> <request.json | ->   (the same, without npm\'s start-up)',
    '',
    'Runs one Stillspan compute command on a JSON request (a file, or - for standard input) and prints the JSON',
    'answer. SI units, named in every field. Exit 0: answer on stdout; exit 2: bad input, the last line of stderr',
    'is {"error":{"code","message","issues":[{"path","message"}]}}; exit 1: internal failure.',
    '',
    'Commands:',
    ...commandNames(catalogue).map((name) => `  ${name.padEnd(11)} ${catalogue.summaries[name]}`),
    '',
    'Results support, and never replace, the judgement of a qualified engineer; local codes and licensed practice govern.',
  ];
  return lines.join('\n') + '\n';
}

function fail(io: CalcIo, code: string, message: string, issues: ApiIssue[], exitCode = 2): number {
  const body: ApiErrorBody = { error: { code, message, issues } };
  io.stderr(`${message}\n${JSON.stringify(body)}\n`);
  return exitCode;
}

/** The command `calc` would run for these arguments, or null (help, wrong arguments, unknown command). */
export function commandToLoad(args: readonly string[], summaries: Readonly<Record<string, string>>): string | null {
  return args.length === 2 && Object.prototype.hasOwnProperty.call(summaries, args[0]) ? args[0] : null;
}

/** Runs `calc` with its arguments (after the script name) on a catalogue of commands; returns the exit code. */
export function runCalcWith(args: readonly string[], io: CalcIo, catalogue: CommandCatalogue): number {
  if (args.length === 1 && (args[0] === '--help' || args[0] === '-h' || args[0] === 'help')) {
    io.stdout(usageOf(catalogue));
    return 0;
  }
  if (args.length !== 2) {
    io.stderr(usageOf(catalogue));
    return fail(io, errorCodes.invalidRequest, `calc needs exactly two arguments, <command> and <request.json | ->, got ${args.length}`, [
      { path: '', message: 'usage: calc <command> <request.json | ->' },
    ]);
  }
  const [name, source] = args;
  if (commandToLoad(args, catalogue.summaries) === null) {
    const known = commandNames(catalogue).join(', ');
    return fail(io, errorCodes.unknownCommand, `Unknown command "${name}"; the commands are ${known}`, [
      { path: '', message: `command: must be one of ${known}` },
    ]);
  }
  let text: string;
  try {
    text = source === '-' ? io.readStdin() : io.readFile(source);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return fail(io, errorCodes.unreadableInput, `Cannot read the request ${source === '-' ? 'from standard input' : `file ${source}`}: ${reason}`, [
      { path: '', message: `request: cannot be read (${reason})` },
    ]);
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return fail(io, errorCodes.unreadableInput, `The request is not valid JSON: ${reason}`, [{ path: '', message: `request: must be valid JSON (${reason})` }]);
  }
  const { command, toApiIssues } = catalogue.load(name);
  const parsed = command.request.safeParse(body);
  if (!parsed.success) {
    const issues = toApiIssues(parsed.error);
    return fail(io, errorCodes.invalidRequest, `Invalid ${name} request: ${issues.map((issue) => issue.message).join('; ')}`, issues);
  }
  let answer: unknown;
  try {
    answer = command.run(parsed.data);
  } catch (error) {
    if (error instanceof ComputeInputError) {
      return fail(io, errorCodes.invalidRequest, `Invalid ${name} request: ${error.message}`, error.issues);
    }
    const reason = error instanceof Error ? error.message : String(error);
    return fail(io, errorCodes.internalError, `The ${name} command failed: ${reason}`, [], 1);
  }
  io.stdout(`${JSON.stringify(answer)}\n`);
  return 0;
}

/**
 * Entry point used by server/cli/calc.mjs. `baseDirectory` is where the user typed the command (npm runs scripts
 * from the package root, so the launcher passes npm's record of the original directory).
 */
export function mainWith(argv: readonly string[], baseDirectory: string, catalogue: CommandCatalogue): void {
  // A reader that stops early (`calc … | head`) is not an error of the command.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
  process.exitCode = runCalcWith(argv, createIo(baseDirectory), catalogue);
}
