import { describe, expect, it } from 'vitest';
import { HttpError } from '../../lib/http-error';
import { analyseRecord, recordTimeHistory } from './site-record-analysis';

/** A CSV of n samples at 100 Hz: a(t) = sin(2π·1.5·t) (test input). */
function sineCsv(n: number): Buffer {
  const lines = ['t,a'];
  for (let i = 0; i < n; i++) lines.push(`${(i / 100).toFixed(2)},${Math.sin(2 * Math.PI * 1.5 * (i / 100)).toFixed(6)}`);
  return Buffer.from(lines.join('\n'));
}

describe('recordTimeHistory', () => {
  it('keeps a short record whole and thins a long one to 4000 points that keep each stretch’s extremes', () => {
    expect(recordTimeHistory(sineCsv(500), 0, undefined)).toMatchObject({ thinned: false, sampleCount: 500 });
    const long = recordTimeHistory(sineCsv(20_000), 0, undefined);
    expect(long.thinned).toBe(true);
    expect(long.timesS).toHaveLength(4000);
    expect(Math.max(...long.accelerationMPerS2)).toBeCloseTo(1, 3);
    expect(Math.min(...long.accelerationMPerS2)).toBeCloseTo(-1, 3);
    for (let i = 1; i < long.timesS.length; i++) expect(long.timesS[i]).toBeGreaterThan(long.timesS[i - 1]);
  });
});

describe('analyseRecord', () => {
  it('names the file when the record is too short for the band, and the field for a bad channel', async () => {
    // 100 rows at 100 Hz = 1 s: shorter than 10 periods of the default band's 0.5 Hz lower edge (docs/engine.md).
    const short = await analyseRecord({ fileBytes: sineCsv(100) }).catch((error: unknown) => error);
    expect(short).toBeInstanceOf(HttpError);
    expect((short as HttpError).details).toEqual([{ path: 'file', message: expect.stringMatching(/^file: the record lasts 1\.000 s, shorter than 10 periods/) as unknown }]);
    const channel = await analyseRecord({ fileBytes: sineCsv(2000), channel: 3 }).catch((error: unknown) => error);
    expect((channel as HttpError).details[0].path).toBe('channel');
  });
});
