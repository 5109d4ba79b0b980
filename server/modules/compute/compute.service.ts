import { getComputeCommand, computeCommands } from '../../../shared/compute/commands';
import { ComputeInputError, errorCodes } from '../../../shared/compute/types';
import { toApiIssues } from '../../../shared/contracts/errors';
import { HttpError } from '../../lib/http-error';

export function listComputeCommands(): { name: string; summary: string }[] {
  return Object.values(computeCommands)
    .map((command) => ({ name: command.name, summary: command.summary }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/** Validates the request with the command's own schema and runs it; the same rules as the `calc` command. */
export function runComputeCommand(name: string, body: unknown): unknown {
  const command = getComputeCommand(name);
  if (!command) {
    throw new HttpError(404, errorCodes.unknownCommand, `There is no compute command "${name}"; GET /api/compute lists them`);
  }
  const request = command.request.safeParse(body ?? {});
  if (!request.success) {
    const issues = toApiIssues(request.error);
    throw new HttpError(400, errorCodes.invalidRequest, issues.length === 1 ? issues[0].message : `${issues.length} fields are invalid`, issues);
  }
  try {
    return command.run(request.data);
  } catch (error) {
    // The commands turn the engine's input checks into ComputeInputError; anything else is a fault (500), as in `calc`.
    if (error instanceof ComputeInputError) throw new HttpError(400, errorCodes.invalidRequest, error.message, error.issues);
    throw error;
  }
}
