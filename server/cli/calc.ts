/**
 * `calc <command> <request.json|->`: runs one compute command on a JSON request and prints the JSON answer.
 * Exit 0 with the answer on stdout; exit 2 with `{ "error": { code, message, issues } }` as the last line of stderr
 * for bad input (unknown command, unreadable file, invalid JSON, a request the schema or the mathematics refuses);
 * exit 1 for an internal failure. The same commands and schemas serve POST /api/compute/<command>.
 */
import { readFileSync, readSync } from 'node:fs';
import { resolve } from 'node:path';
import { computeCommands, getComputeCommand } from '../../shared/compute/commands';
import { ComputeInputError, errorCodes } from '../../shared/compute/types';
import { toApiIssues, type ApiErrorBody, type ApiIssue } from '../../shared/contracts/errors';

export interface CalcIo {
  readStdin(): string;
  readFile(path: string): string;
  stdout(text: string): void;
  stderr(text: string): void;
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

export const defaultIo: CalcIo = createIo();

export function usage(): string {
  const names = Object.keys(computeCommands).sort();
  const lines = [
    'Usage: npm run --silent calc -- <command> <request.json | ->',
    '',
    'Runs one Stillspan compute command on a JSON request (a file, or - for standard input) and prints the JSON',
    'answer. SI units, named in every field. Exit 0: answer on stdout; exit 2: bad input, the last line of stderr',
    'is {"error":{"code","message","issues":[{"path","message"}]}}; exit 1: internal failure.',
    '',
    'Commands:',
    ...names.map((name) => `  ${name.padEnd(11)} ${computeCommands[name].summary}`),
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

/** Runs `calc` with its arguments (after the script name); returns the exit code. */
export function runCalc(args: readonly string[], io: CalcIo = defaultIo): number {
  if (args.length === 1 && (args[0] === '--help' || args[0] === '-h' || args[0] === 'help')) {
    io.stdout(usage());
    return 0;
  }
  if (args.length !== 2) {
    io.stderr(usage());
    return fail(io, errorCodes.invalidRequest, `calc needs exactly two arguments, <command> and <request.json | ->, got ${args.length}`, [
      { path: '', message: 'usage: calc <command> <request.json | ->' },
    ]);
  }
  const [name, source] = args;
  const command = getComputeCommand(name);
  if (!command) {
    const known = Object.keys(computeCommands).sort().join(', ');
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
export function main(argv: readonly string[] = process.argv.slice(2), baseDirectory: string = process.cwd()): void {
  // A reader that stops early (`calc … | head`) is not an error of the command.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
  process.exitCode = runCalc(argv, createIo(baseDirectory));
}
