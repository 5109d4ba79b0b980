/**
 * What one engine worker thread does with one task: validate the request with the command's own schema, run the
 * command, and serialise the answer, refusing one larger than the limit. Everything here runs off the server's
 * event loop; the answer travels back as a JSON string, so the main thread neither parses nor serialises it.
 */
import type { MessagePort } from 'node:worker_threads';
import { getComputeCommand } from '../../shared/compute/commands';
import { ComputeInputError, errorCodes } from '../../shared/compute/types';
import { toApiIssues, type ApiIssue } from '../../shared/contracts/errors';

export interface EngineTask {
  command: string;
  request: unknown;
  /** Largest answer (bytes of UTF-8 JSON) the caller accepts. */
  maxAnswerBytes: number;
  /** The worker says "started" on it when the task begins to run (after the engine has loaded). */
  startedPort?: MessagePort;
}

export type EngineTaskResult =
  | { ok: true; json: string }
  | { ok: false; status: number; code: string; message: string; issues: ApiIssue[] };

function formatBytes(bytes: number): string {
  return bytes >= 1e6 ? `${(bytes / 1e6).toFixed(1)} MB` : `${Math.ceil(bytes / 1e3)} kB`;
}

export function runEngineTask(task: EngineTask): EngineTaskResult {
  const command = getComputeCommand(task.command);
  if (!command) {
    return { ok: false, status: 404, code: errorCodes.unknownCommand, message: `There is no compute command "${task.command}"; GET /api/compute lists them`, issues: [] };
  }
  const request = command.request.safeParse(task.request ?? {});
  if (!request.success) {
    const issues = toApiIssues(request.error);
    return { ok: false, status: 400, code: errorCodes.invalidRequest, message: issues.length === 1 ? issues[0].message : `${issues.length} fields are invalid`, issues };
  }
  let answer: unknown;
  try {
    answer = command.run(request.data);
  } catch (error) {
    // The commands turn the engine's input checks into ComputeInputError; anything else is a fault (500).
    if (error instanceof ComputeInputError) return { ok: false, status: 400, code: errorCodes.invalidRequest, message: error.message, issues: error.issues };
    throw error;
  }
  const json = JSON.stringify(answer);
  const bytes = Buffer.byteLength(json, 'utf8');
  if (bytes > task.maxAnswerBytes) {
    return {
      ok: false,
      status: 422,
      code: 'answer_too_large',
      message: `The answer would be ${formatBytes(bytes)}, more than the ${formatBytes(task.maxAnswerBytes)} allowed: ask for fewer points or factors`,
      issues: [],
    };
  }
  return { ok: true, json };
}
