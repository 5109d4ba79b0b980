/**
 * Reads a site record written as delimited text: a header row, then the time in s in the first column and one or
 * more accelerations in m/s² in the others (comma, semicolon or tab separated). A file with a single column holds
 * accelerations only, and then needs its sample rate from elsewhere. Parsing by papaparse; every refusal names the
 * 1-based row of the file and the column at fault, so that the person can find it in a spreadsheet.
 */
import Papa from 'papaparse';

/** Time steps may differ from their mean by at most this fraction (a logger's clock jitter; common practice). */
export const TIME_STEP_TOLERANCE_RATIO = 0.01;
/** Fewest data rows a record may have (the identify command needs 64 samples anyway). */
export const MIN_RECORD_ROWS = 64;

export class RecordFileError extends Error {
  override name = 'RecordFileError';
  constructor(
    message: string,
    /** 1-based row of the file (the header is row 1), or null when the fault is the file as a whole. */
    readonly row: number | null = null,
    /** The column's header, or null. */
    readonly column: string | null = null,
  ) {
    super(message);
  }
}

export interface RecordFileOptions {
  /** Header name or 0-based index among the acceleration columns; default the first. */
  channel?: string | number;
  /** Needed (and only allowed) for a file with a single column. */
  sampleRateHz?: number;
}

export interface ParsedRecordFile {
  sampleRateHz: number;
  accelerationMPerS2: Float64Array;
  /** Header of the chosen acceleration column and its 0-based index among the acceleration columns. */
  channelName: string;
  channelIndex: number;
  /** Headers of every acceleration column. */
  channels: string[];
  delimiter: string;
  /** Null for a single-column file. */
  timeColumn: string | null;
}

const delimiters = [',', ';', '\t'];

function looksBinary(text: string): boolean {
  const sample = text.slice(0, 4096);
  let control = 0;
  for (let i = 0; i < sample.length; i++) {
    const code = sample.charCodeAt(i);
    if (code === 0 || code === 0xfffd) return true;
    if (code < 32 && code !== 9 && code !== 10 && code !== 13) control++;
  }
  return control > sample.length * 0.01;
}

/** A number as a data logger writes it: decimal point, optional exponent. An empty cell is not a number. */
function readNumber(cell: string): number {
  const trimmed = cell.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(trimmed)) return Number.NaN;
  return Number(trimmed);
}

export function parseRecordFile(text: string, options: RecordFileOptions = {}): ParsedRecordFile {
  if (text.length === 0) throw new RecordFileError('the file is empty');
  if (looksBinary(text)) throw new RecordFileError('is not a text file (it holds binary data): send a CSV with a header row, time in s, then accelerations in m/s²');
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const result = Papa.parse<string[]>(body, { delimitersToGuess: delimiters, skipEmptyLines: 'greedy' });
  const rows = result.data;
  if (rows.length === 0) throw new RecordFileError('the file holds no rows');
  const header = rows[0].map((name) => name.trim());
  const delimiter = result.meta.delimiter;
  const columnCount = header.length;
  const single = columnCount === 1;
  if (header.some((name) => name === '')) {
    throw new RecordFileError(`row 1 (the header): column ${header.findIndex((name) => name === '') + 1} has no name`, 1, null);
  }
  if (single && options.sampleRateHz === undefined) {
    throw new RecordFileError('has a single column: give sampleRateHz, or add a first column of time in s', null, header[0]);
  }
  if (!single && options.sampleRateHz !== undefined) {
    throw new RecordFileError('has a time column, so sampleRateHz must not be given as well', null, header[0]);
  }
  const dataRows = rows.length - 1;
  if (dataRows < MIN_RECORD_ROWS) throw new RecordFileError(`has ${dataRows} data rows; a record needs at least ${MIN_RECORD_ROWS}`, rows.length, null);
  const channels = single ? header : header.slice(1);
  let channelIndex = 0;
  if (typeof options.channel === 'number') {
    if (!Number.isInteger(options.channel) || options.channel < 0 || options.channel >= channels.length) {
      throw new RecordFileError(`channel ${options.channel} does not exist: the file has ${channels.length} acceleration column(s), 0 to ${channels.length - 1}`);
    }
    channelIndex = options.channel;
  } else if (typeof options.channel === 'string') {
    channelIndex = channels.indexOf(options.channel.trim());
    if (channelIndex < 0) throw new RecordFileError(`channel "${options.channel}" is not a column of the file (its acceleration columns: ${channels.join(', ')})`);
  }
  const column = single ? 0 : channelIndex + 1;
  const acceleration = new Float64Array(dataRows);
  const times = single ? null : new Float64Array(dataRows);
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r];
    const fileRow = r + 1;
    if (row.length !== columnCount) throw new RecordFileError(`row ${fileRow} has ${row.length} column(s), the header ${columnCount}`, fileRow, null);
    if (times) {
      const t = readNumber(row[0]);
      if (!Number.isFinite(t)) throw new RecordFileError(`row ${fileRow}, column "${header[0]}": "${row[0]}" is not a number`, fileRow, header[0]);
      times[r - 1] = t;
    }
    const a = readNumber(row[column]);
    if (!Number.isFinite(a)) throw new RecordFileError(`row ${fileRow}, column "${header[column]}": "${row[column]}" is not a number`, fileRow, header[column]);
    acceleration[r - 1] = a;
  }
  let sampleRateHz: number;
  if (times) {
    const meanStepS = (times[dataRows - 1] - times[0]) / (dataRows - 1);
    if (!(meanStepS > 0)) throw new RecordFileError(`column "${header[0]}": time must increase from row 2 to row ${rows.length}`, 2, header[0]);
    for (let i = 1; i < dataRows; i++) {
      const step = times[i] - times[i - 1];
      if (Math.abs(step - meanStepS) > TIME_STEP_TOLERANCE_RATIO * meanStepS) {
        throw new RecordFileError(
          `row ${i + 2}, column "${header[0]}": the time step ${step} s differs from the mean step ${meanStepS} s by more than ${TIME_STEP_TOLERANCE_RATIO * 100} % (samples must be evenly spaced)`,
          i + 2,
          header[0],
        );
      }
    }
    sampleRateHz = 1 / meanStepS;
  } else {
    sampleRateHz = options.sampleRateHz as number;
  }
  return { sampleRateHz, accelerationMPerS2: acceleration, channelName: channels[channelIndex], channelIndex, channels, delimiter, timeColumn: single ? null : header[0] };
}
