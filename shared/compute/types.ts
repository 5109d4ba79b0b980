import type { z } from 'zod';
import type { ApiIssue } from '../contracts/errors';
import { prefixIssues, prefixMessage } from '../contracts/paths';

/**
 * One compute command: the zod schema of its request (the same for `calc` and POST /api/compute/<name>),
 * the schema of its answer, and a pure function from the parsed request to the answer.
 */
export interface ComputeCommand<Req = unknown, Res = unknown> {
  name: string;
  summary: string;
  request: z.ZodType<Req>;
  response: z.ZodType<Res>;
  run(request: Req): Res;
}

/**
 * Thrown by a command's `run` when the request passed the schema but the mathematics refuses it
 * (for example a mass matrix that is not positive definite). `calc` exits 2 with it, the API answers 400.
 */
export class ComputeInputError extends Error {
  readonly issues: ApiIssue[];
  constructor(message: string, issues: ApiIssue[]) {
    super(message);
    this.name = 'ComputeInputError';
    this.issues = issues;
  }

  /**
   * The same refusal with `prefix` in front of every path, for a caller that holds the request inside something of
   * its own (a stored mode's `dampingRatio` under the form field that holds the mode).
   */
  prefixed(prefix: string): ComputeInputError {
    const issues = prefixIssues(prefix, this.issues);
    return new ComputeInputError(issues.length === 1 ? issues[0].message : prefixMessage(prefix, '', this.message), issues);
  }
}

/** Error codes shared by the API and `calc`. */
export const errorCodes = {
  invalidRequest: 'invalid_request',
  unknownCommand: 'unknown_command',
  unreadableInput: 'unreadable_input',
  internalError: 'internal_error',
} as const;
