/**
 * What one engine worker thread does with one task: validate the request with the command's own schema, run the
 * command, and serialise the answer, refusing one larger than the limit. Everything here runs off the server's
 * event loop; the answer travels back as a JSON string, so the main thread neither parses nor serialises it.
 */
import type { MessagePort } from 'node:worker_threads';
import { getComputeCommand } from '../../shared/compute/commands';
import { ComputeInputError, errorCodes } from '../../shared/compute/types';
import { toApiIssues, type ApiIssue } from '../../shared/contracts/errors';
import { computeVariantCurves, computeVariantResult, computeVariantSize, type VariantComputeInput } from '../../shared/compute/variant';
import { HttpError } from '../lib/http-error';
import { analyseRecordInline, type AnalyseRecordInput } from '../modules/site-records/site-record-analysis';

/**
 * Engine work of the server's own modules (not a compute command of the API): a tuning variant's computations, and a
 * site record's reading (the CSV file parsed here, off the event loop) and analysis.
 */
export type EngineJob =
  | { kind: 'variant-result'; input: VariantComputeInput }
  | { kind: 'variant-size'; input: VariantComputeInput }
  | { kind: 'variant-curves'; input: VariantComputeInput; loadCaseIndex: number }
  | { kind: 'site-record-analysis'; input: AnalyseRecordInput };

function runJob(job: EngineJob): unknown {
  switch (job.kind) {
    case 'variant-result':
      return computeVariantResult(job.input);
    case 'variant-size':
      return computeVariantSize(job.input);
    case 'variant-curves':
      return computeVariantCurves(job.input, job.loadCaseIndex);
    case 'site-record-analysis':
      return analyseRecordInline(job.input);
  }
}

export interface EngineTask {
  /** A compute command of the API (validated by its own schema here) … */
  command: string;
  /** … or, instead, a job of the server's own modules, whose input the module built and checked. */
  job?: EngineJob;
  request: unknown;
  /** Largest answer (bytes of UTF-8 JSON) the caller accepts. */
  maxAnswerBytes: number;
  /** The worker says "started" on it when the task begins to run (after the engine has loaded). */
  startedPort?: MessagePort;
  /** Instead of engine work: the worker answers where its engine code came from ("bundle build-…" or "sources"). */
  probe?: 'origin';
}

export type EngineTaskResult =
  | { ok: true; json: string }
  | { ok: false; status: number; code: string; message: string; issues: ApiIssue[] };

function formatBytes(bytes: number): string {
  return bytes >= 1e6 ? `${(bytes / 1e6).toFixed(1)} MB` : `${Math.ceil(bytes / 1e3)} kB`;
}

function serialise(answer: unknown, maxAnswerBytes: number): EngineTaskResult {
  const json = JSON.stringify(answer);
  const bytes = Buffer.byteLength(json, 'utf8');
  if (bytes > maxAnswerBytes) {
    return {
      ok: false,
      status: 422,
      code: 'answer_too_large',
      message: `The answer would be ${formatBytes(bytes)}, more than the ${formatBytes(maxAnswerBytes)} allowed: ask for fewer points or factors`,
      issues: [],
    };
  }
  return { ok: true, json };
}

function refusal(error: unknown): EngineTaskResult {
  // The engine's input checks throw ComputeInputError; anything else is a fault (500).
  if (error instanceof ComputeInputError) return { ok: false, status: 400, code: errorCodes.invalidRequest, message: error.message, issues: error.issues };
  // A job of the server's own modules refuses its input as the module would (a site record's file: 400 naming it).
  if (error instanceof HttpError) return { ok: false, status: error.status, code: error.code, message: error.message, issues: error.details };
  throw error;
}

export function runEngineTask(task: EngineTask): EngineTaskResult {
  if (task.job) {
    let answer: unknown;
    try {
      answer = runJob(task.job);
    } catch (error) {
      return refusal(error);
    }
    return serialise(answer, task.maxAnswerBytes);
  }
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
    return refusal(error);
  }
  return serialise(answer, task.maxAnswerBytes);
}
