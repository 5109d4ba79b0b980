/**
 * `calc <command> <request.json|->` over the whole registry of compute commands (shared/compute/commands): the same
 * behaviour as the launcher server/cli/calc.mjs, which loads only the bundle of the command asked for. The logic
 * lives in ./calc-core; this module binds it to every command at once (for code that already has them all loaded).
 */
import { computeCommands, getComputeCommand } from '../../shared/compute/commands';
import { toApiIssues } from '../../shared/contracts/errors';
import { createIo, mainWith, runCalcWith, usageOf, type CalcIo, type CommandCatalogue } from './calc-core';

export { createIo, readStandardInput, type CalcIo } from './calc-core';

/** Every registered command, loaded. */
export const registryCatalogue: CommandCatalogue = {
  summaries: Object.fromEntries(Object.entries(computeCommands).map(([name, command]) => [name, command.summary])),
  load(name) {
    const command = getComputeCommand(name);
    if (!command) throw new RangeError(`command: unknown command ${name}`);
    return { command, toApiIssues };
  },
};

export const defaultIo: CalcIo = createIo();

export function usage(): string {
  return usageOf(registryCatalogue);
}

/** Runs `calc` with its arguments (after the script name); returns the exit code. */
export function runCalc(args: readonly string[], io: CalcIo = defaultIo): number {
  return runCalcWith(args, io, registryCatalogue);
}

/** Runs `calc` on the process's arguments; relative request paths are read from `baseDirectory`. */
export function main(argv: readonly string[] = process.argv.slice(2), baseDirectory: string = process.cwd()): void {
  mainWith(argv, baseDirectory, registryCatalogue);
}
