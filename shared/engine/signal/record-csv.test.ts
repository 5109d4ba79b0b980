import { describe, expect, it } from 'vitest';
import { parseRecordFile, RecordFileError } from './record-csv';

/** A file of n rows at `rateHz`: time, then a(t) = sin(t) and 2 sin(t) (test values, no structure). */
function csv(n: number, rateHz: number, separator = ',', header = ['time_s', 'a1', 'a2']): string {
  const lines = [header.join(separator)];
  for (let i = 0; i < n; i++) {
    const t = i / rateHz;
    lines.push([t.toFixed(6), Math.sin(t).toExponential(6), (2 * Math.sin(t)).toExponential(6)].slice(0, header.length).join(separator));
  }
  return `${lines.join('\n')}\n`;
}

function refusal(run: () => unknown): RecordFileError {
  try {
    run();
  } catch (error) {
    if (error instanceof RecordFileError) return error;
    throw error;
  }
  throw new Error('expected a RecordFileError');
}

describe('parseRecordFile', () => {
  it('reads time and the first acceleration column, and the sample rate from the time steps', () => {
    const file = parseRecordFile(csv(200, 100));
    expect(file.sampleRateHz).toBeCloseTo(100, 6);
    expect(file.channels).toEqual(['a1', 'a2']);
    expect(file.channelName).toBe('a1');
    expect(file.accelerationMPerS2.length).toBe(200);
    expect(file.accelerationMPerS2[150]).toBeCloseTo(Math.sin(1.5), 5);
  });

  it('chooses a channel by name or by index, and refuses one that is not there', () => {
    expect(parseRecordFile(csv(100, 50), { channel: 'a2' }).accelerationMPerS2[50]).toBeCloseTo(2 * Math.sin(1), 5);
    expect(parseRecordFile(csv(100, 50), { channel: 1 }).channelName).toBe('a2');
    expect(refusal(() => parseRecordFile(csv(100, 50), { channel: 2 })).message).toMatch(/^channel 2 does not exist/);
    expect(refusal(() => parseRecordFile(csv(100, 50), { channel: 'a9' })).message).toMatch(/^channel "a9" is not a column/);
  });

  it('reads semicolon- and tab-separated files', () => {
    expect(parseRecordFile(csv(100, 50, ';')).delimiter).toBe(';');
    expect(parseRecordFile(csv(100, 50, '\t'), { channel: 'a2' }).accelerationMPerS2[50]).toBeCloseTo(2 * Math.sin(1), 5);
  });

  it('reads a single column with a given sample rate, and asks for the rate when it is missing', () => {
    const text = csv(100, 50, ',', ['acc']).replace(/^[^\n]*\n/, 'acc\n');
    const single = ['acc', ...Array.from({ length: 100 }, (_, i) => String(Math.sin(i / 50)))].join('\n');
    expect(parseRecordFile(single, { sampleRateHz: 50 }).sampleRateHz).toBe(50);
    expect(parseRecordFile(single, { sampleRateHz: 50 }).timeColumn).toBeNull();
    expect(refusal(() => parseRecordFile(text)).message).toMatch(/single column: give sampleRateHz/);
  });

  it('names the row and column of a non-number, of an uneven time step, and refuses too few rows and binary data', () => {
    const lines = csv(100, 50).split('\n');
    lines[10] = lines[10].replace(/,[^,]*,/, ',abc,');
    const notANumber = refusal(() => parseRecordFile(lines.join('\n')));
    expect([notANumber.row, notANumber.column]).toEqual([11, 'a1']);

    const uneven = csv(100, 50).split('\n');
    uneven[40] = uneven[40].replace(/^[^,]*/, (40 / 50 - 1 / 50 + 0.005).toFixed(6)); // row 41 = sample 39 moved by a quarter step
    const step = refusal(() => parseRecordFile(uneven.join('\n')));
    expect(step.column).toBe('time_s');
    expect(step.row).toBe(41);

    const few = refusal(() => parseRecordFile(csv(20, 50)));
    expect(few.message).toMatch(/20 data rows/);

    expect(refusal(() => parseRecordFile('\u0000\u0001PK\u0003\u0004binary')).message).toMatch(/binary/);
  });
});
