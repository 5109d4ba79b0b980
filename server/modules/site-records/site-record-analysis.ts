/**
 * The analysis of one site record: read the stored file, pick the channel, run `identify`. Given the server's engine
 * pool, the whole of it (reading a CSV of up to 20 MB included) runs on a worker thread under the pool's time limit, as
 * the job `site-record-analysis`, so the event loop only hands over the bytes; the demo seed and unit tests run it inline.
 */
import { identifyCommand } from '../../../shared/compute/identify-command';
import { ComputeInputError } from '../../../shared/compute/types';
import { identifyRequestSchema, type IdentifyResponse } from '../../../shared/contracts/identify';
import { parseRecordFile, RecordFileError, type ParsedRecordFile } from '../../../shared/engine/signal/record-csv';
import { SITE_RECORD_PLOT_POINTS, type SiteRecordTimeHistory } from '../../../shared/contracts/site-records';
import { HttpError, invalidField } from '../../lib/http-error';
import type { EnginePool } from '../../workers/engine-pool';

export interface AnalyseRecordInput {
  fileBytes: Uint8Array;
  /** Column name, or 0-based index among the acceleration columns (a string of digits counts as an index). */
  channel?: string | number;
  /** For a single-column file. */
  sampleRateHz?: number;
  method?: 'spectrum' | 'decay';
  bandHz?: [number, number];
}

export interface AnalysedRecord {
  file: Omit<ParsedRecordFile, 'accelerationMPerS2'> & { sampleCount: number };
  analysis: IdentifyResponse;
}

function channelOption(channel: string | number | undefined): string | number | undefined {
  if (typeof channel === 'string' && /^\d+$/.test(channel.trim())) return Number(channel.trim());
  return channel;
}

/** A refused file as 400 naming `file` (with the row and column in the message when there is one). */
function fileError(error: RecordFileError): HttpError {
  const where = [error.row === null ? null : `row ${error.row}`, error.column === null ? null : `column "${error.column}"`].filter(Boolean).join(', ');
  const message = error.message.startsWith('row ') || where === '' ? `file: ${error.message}` : `file: ${where}: ${error.message}`;
  return new HttpError(400, 'invalid_request', message, [{ path: 'file', message }]);
}

function readStoredFile(fileBytes: Uint8Array, channel: string | number | undefined, sampleRateHz: number | undefined): ParsedRecordFile {
  const text = new TextDecoder('utf-8').decode(fileBytes);
  return parseRecordFile(text, { channel: channelOption(channel), sampleRateHz });
}

/** The stored record's chosen channel for a plot, thinned to each bucket's lowest and highest sample. */
export function recordTimeHistory(fileBytes: Uint8Array, channel: number, sampleRateHz: number | undefined): SiteRecordTimeHistory {
  const file = readStoredFile(fileBytes, channel, sampleRateHz);
  const samples = file.accelerationMPerS2;
  const n = samples.length;
  const dt = 1 / file.sampleRateHz;
  const base = { channel: file.channelName, sampleRateHz: file.sampleRateHz, sampleCount: n };
  if (n <= SITE_RECORD_PLOT_POINTS) {
    return { ...base, thinned: false, timesS: Array.from({ length: n }, (_, i) => i * dt), accelerationMPerS2: Array.from(samples) };
  }
  const buckets = SITE_RECORD_PLOT_POINTS / 2;
  const timesS: number[] = [];
  const values: number[] = [];
  for (let b = 0; b < buckets; b++) {
    const start = Math.floor((b * n) / buckets);
    const end = Math.floor(((b + 1) * n) / buckets);
    let low = start;
    let high = start;
    for (let i = start + 1; i < end; i++) {
      if (samples[i] < samples[low]) low = i;
      if (samples[i] > samples[high]) high = i;
    }
    const [first, second] = low <= high ? [low, high] : [high, low];
    timesS.push(first * dt, second * dt);
    values.push(samples[first], samples[second]);
  }
  return { ...base, thinned: true, timesS, accelerationMPerS2: values };
}

/** Reads the file and runs identify on the calling thread; refusals are HttpError 400 naming the field. */
export function analyseRecordInline(input: AnalyseRecordInput): AnalysedRecord {
  let parsed: ParsedRecordFile;
  try {
    parsed = readStoredFile(input.fileBytes, input.channel, input.sampleRateHz);
  } catch (error) {
    if (error instanceof RecordFileError) {
      if (error.message.startsWith('channel')) throw invalidField('channel', error.message.replace(/^channel /, ''));
      if (error.message.includes('sampleRateHz must not')) throw invalidField('sampleRateHz', 'must not be given for a file with a time column');
      throw fileError(error);
    }
    throw error;
  }
  const request = identifyRequestSchema.safeParse({
    sampleRateHz: parsed.sampleRateHz,
    accelerationMPerS2: Array.from(parsed.accelerationMPerS2),
    bandHz: input.bandHz,
    method: input.method,
  });
  if (!request.success) {
    const issues = request.error.issues.map((issue) => {
      const head = String(issue.path[0] ?? '');
      // The samples and their sample rate come from the file: name it.
      const path = head === 'accelerationMPerS2' || head === 'sampleRateHz' ? 'file' : head;
      const what = head === 'accelerationMPerS2' ? 'the record' : head === 'sampleRateHz' ? 'the sample rate' : '';
      const prefix = what && !issue.message.startsWith(what) ? `${what} ` : '';
      return { path, message: `${path}: ${prefix}${issue.message}` };
    });
    throw new HttpError(400, 'invalid_request', issues.map((issue) => issue.message).join('; '), issues);
  }
  let analysis: IdentifyResponse;
  try {
    analysis = identifyCommand.run(request.data);
  } catch (error) {
    if (error instanceof ComputeInputError) throw new HttpError(400, 'invalid_request', error.message, error.issues);
    throw error;
  }
  const { accelerationMPerS2, ...file } = parsed;
  return { file: { ...file, sampleCount: accelerationMPerS2.length }, analysis };
}

/**
 * The analysis, in the engine pool when one is given (the worker throws the same HttpError, which the pool hands back
 * with its status, code, message and issues), else inline.
 */
export async function analyseRecord(input: AnalyseRecordInput, engine?: EnginePool): Promise<AnalysedRecord> {
  if (engine) return engine.runJob<AnalysedRecord>({ kind: 'site-record-analysis', input });
  return analyseRecordInline(input);
}
