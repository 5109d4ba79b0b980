import { computeCommands, getComputeCommand } from '../../../shared/compute/commands';
import { errorCodes } from '../../../shared/compute/types';
import { HttpError } from '../../lib/http-error';
import type { EnginePool } from '../../workers/engine-pool';

export function listComputeCommands(): { name: string; summary: string }[] {
  return Object.values(computeCommands)
    .map((command) => ({ name: command.name, summary: command.summary }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/**
 * Runs a command in the engine's worker pool, which validates the request with the command's own schema (the same
 * rules as the `calc` command) and answers its JSON. An unknown command is refused here, before it is queued.
 */
export function runComputeCommand(pool: EnginePool, name: string, body: unknown): Promise<string> {
  if (!getComputeCommand(name)) {
    throw new HttpError(404, errorCodes.unknownCommand, `There is no compute command "${name}"; GET /api/compute lists them`);
  }
  return pool.runCommand(name, body ?? {});
}
