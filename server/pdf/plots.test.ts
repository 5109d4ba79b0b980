/**
 * The plot module of the server's PDFs: tick choice by Heckbert's nice numbers (P. S. Heckbert, "Nice numbers for
 * graph labels", Graphics Gems, 1990: steps of 1, 2 or 5 × 10^k, the axis widened to whole steps), the mapping of data
 * to page coordinates, breaks in a series, cell edges of a map, the colour scale, and a drawn plot read back by an
 * independent PDF reader (pdf-parse).
 */
import { describe, expect, it } from 'vitest';
import PDFDocument from 'pdfkit';
import { PDFParse } from 'pdf-parse';
import { registerWorkSans } from './fonts';
import {
  cellColourScale,
  cellEdges,
  drawCellMap,
  drawLinePlot,
  formatTick,
  linearMap,
  linePlotFrame,
  niceNumber,
  niceTicks,
  niceTicksWithin,
  polylineRuns,
  utilisationRgb,
} from './plots';

/** A step is nice when it is 1, 2 or 5 times a power of ten (Heckbert 1990). */
function isNiceStep(step: number): boolean {
  const power = 10 ** Math.floor(Math.log10(step) + 1e-12);
  const mantissa = step / power;
  return [1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-9);
}

describe('nice numbers (Heckbert 1990)', () => {
  it('rounds to 1, 2, 5 or 10 × 10^k: to the nearest for a step, upwards for a range', () => {
    expect(niceNumber(7.3, false)).toBe(10);
    expect(niceNumber(4, false)).toBe(5);
    expect(niceNumber(1.6, false)).toBe(2);
    expect(niceNumber(1, false)).toBe(1);
    expect(niceNumber(2.6, true)).toBe(2);
    expect(niceNumber(3.4, true)).toBe(5);
    expect(niceNumber(1.2, true)).toBe(1);
    expect(niceNumber(7.3, true)).toBe(10);
    expect(niceNumber(0.034, true)).toBeCloseTo(0.05, 15);
    expect(niceNumber(438, false)).toBe(500);
    expect(() => niceNumber(0, true)).toThrow(RangeError);
    expect(() => niceNumber(Number.NaN, true)).toThrow(RangeError);
  });

  it('chooses ticks of a nice step that cover the data with whole steps', () => {
    // A bare footbridge's response, 0 to 3.44 m/s², five intervals wanted: 0.688 → step 0.5, axis 0 to 3.5.
    expect(niceTicks(0, 3.44, 5)).toEqual({ min: 0, max: 3.5, step: 0.5, values: [0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5], decimals: 1 });
    // Four wanted: 0.86 → step 1, axis 0 to 4.
    expect(niceTicks(0, 3.44, 4).values).toEqual([0, 1, 2, 3, 4]);
    // A damped response of 0.07528 m/s² with a 1 m/s² limit: 0 to 1.04 → 0.208 → step 0.2, axis 0 to 1.2.
    expect(niceTicks(0, 1.04, 5).values).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1, 1.2]);
    // A walker's crossing of 25.67 s, seven wanted: 3.67 → step 5.
    expect(niceTicks(0, 25.67, 7).values).toEqual([0, 5, 10, 15, 20, 25, 30]);
    // Frequencies 1.0 to 2.6 Hz, about eight intervals: step 0.2.
    const band = niceTicks(1.0, 2.6, 8);
    expect(band.step).toBeCloseTo(0.2, 15);
    expect(band.values).toEqual([1, 1.2, 1.4, 1.6, 1.8, 2, 2.2, 2.4, 2.6]);
    expect(band.decimals).toBe(1);
    // Heckbert's own range, 105 to 543: 87.6 → step 100, 100 … 600.
    expect(niceTicks(105, 543, 5).values).toEqual([100, 200, 300, 400, 500, 600]);
    // A signed history: 0.1217 → step 0.1.
    expect(niceTicks(-0.32, 0.41, 6).values).toEqual([-0.4, -0.3, -0.2, -0.1, 0, 0.1, 0.2, 0.3, 0.4, 0.5]);
  });

  it('holds for ranges of every size and position: nice step, covering ends, even spacing, a sensible count', () => {
    let seed = 12345;
    const random = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let trial = 0; trial < 500; trial++) {
      const scale = 10 ** (Math.floor(random() * 16) - 8);
      const lo = (random() - 0.5) * 10 * scale;
      const hi = lo + random() * 10 * scale + scale * 1e-3;
      const target = 2 + Math.floor(random() * 9);
      const ticks = niceTicks(lo, hi, target);
      expect(isNiceStep(ticks.step), `${lo}…${hi}: step ${ticks.step}`).toBe(true);
      expect(ticks.min).toBeLessThanOrEqual(lo + ticks.step * 1e-6);
      expect(ticks.max).toBeGreaterThanOrEqual(hi - ticks.step * 1e-6);
      expect(ticks.values.length).toBeGreaterThanOrEqual(2);
      // The nearest nice step is at least two thirds of range / target, so at most 1.5 × target + 2 intervals.
      expect(ticks.values.length - 1).toBeLessThanOrEqual(1.5 * target + 2);
      for (let i = 1; i < ticks.values.length; i++) {
        expect(Math.abs(ticks.values[i] - ticks.values[i - 1] - ticks.step)).toBeLessThan(ticks.step * 1e-6);
      }
      // Every tick is shown exactly with the decimals given.
      for (const v of ticks.values) expect(Number(formatTick(v, ticks.decimals))).toBeCloseTo(v, ticks.decimals + 6);
    }
  });

  it('keeps a fixed axis inside its ends, widens an empty range, and labels without "-0"', () => {
    const within = niceTicksWithin(1.6, 7.2, 6);
    expect(within.min).toBe(1.6);
    expect(within.max).toBe(7.2);
    // 5.6 / 6 intervals = 0.93 → step 1; the whole steps inside 1.6…7.2.
    expect(within.step).toBe(1);
    expect(within.values).toEqual([2, 3, 4, 5, 6, 7]);
    expect(niceTicks(2, 2).values).toEqual([1.8, 1.9, 2, 2.1, 2.2]);
    expect(niceTicks(0, 0).min).toBeLessThan(0);
    expect(formatTick(-0, 1)).toBe('0.0');
    expect(formatTick(-1e-17, 2)).toBe('0.00');
    expect(formatTick(0.1 + 0.2, 1)).toBe('0.3');
    expect(formatTick(-0.4, 1)).toBe('-0.4');
  });
});

describe('data to page', () => {
  it('maps a domain onto page coordinates affinely, the value axis upwards', () => {
    const toY = linearMap([0, 4], [300, 100]);
    expect(toY(0)).toBe(300);
    expect(toY(4)).toBe(100);
    expect(toY(1)).toBe(250);
    expect(toY(5)).toBe(50);
    expect(linearMap([2, 2], [0, 10])(7)).toBe(5);
  });

  it("puts the frame's axis ends on the plot area's edges and every value where it belongs", () => {
    const box = { x: 50, y: 100, width: 495, height: 205 };
    const frame = linePlotFrame(box, {
      series: [{ label: 'with damper', x: [1, 1.5, 1.957, 2.6], y: [0.01, 0.2, 0.3439, 0.02], colour: '#000' }],
      rules: [{ value: 1, label: 'limit' }],
      xRange: [1, 2.6],
    });
    const { area, toX, toY } = frame;
    expect(area.x).toBeGreaterThan(box.x);
    expect(area.x + area.width).toBeLessThanOrEqual(box.x + box.width);
    expect(area.y + area.height).toBeLessThan(box.y + box.height);
    expect(toX(1)).toBeCloseTo(area.x, 9);
    expect(toX(2.6)).toBeCloseTo(area.x + area.width, 9);
    expect(frame.yTicks.min).toBe(0);
    expect(toY(0)).toBeCloseTo(area.y + area.height, 9);
    expect(toY(frame.yTicks.max)).toBeCloseTo(area.y, 9);
    // The rule (the comfort limit) is inside the axis although every value is below it.
    expect(frame.yTicks.max).toBeGreaterThanOrEqual(1);
    // The peak at 1.957 Hz sits at (1.957 − 1) / 1.6 of the width.
    expect(toX(1.957)).toBeCloseTo(area.x + (0.957 / 1.6) * area.width, 9);
    expect(toY(0.3439)).toBeCloseTo(area.y + area.height - (0.3439 / frame.yTicks.max) * area.height, 9);
  });

  it('breaks a series at null and non-finite values', () => {
    const runs = polylineRuns([1, 2, 3, 4, 5, 6], [1, null, 3, 4, Number.NaN, 6], (x) => x * 10, (y) => -y);
    expect(runs).toEqual([[[10, -1]], [[30, -3], [40, -4]], [[60, -6]]]);
  });

  it('gives each map cell the edges halfway to its neighbours', () => {
    expect(cellEdges([1, 2, 4])).toEqual([0.5, 1.5, 3, 5]);
    expect(cellEdges([3])).toEqual([2.5, 3.5]);
    expect(cellEdges([])).toEqual([]);
  });
});

describe('colour scale', () => {
  it('is the paper colour at the limit, tide inside it and ember beyond it', () => {
    expect(utilisationRgb(1)).toEqual([246, 243, 236]);
    expect(utilisationRgb(0.5)).toEqual([23, 106, 99]);
    expect(utilisationRgb(-1)).toEqual([8, 47, 44]);
    expect(utilisationRgb(5)).toEqual([138, 66, 19]);
    expect(utilisationRgb(Number.POSITIVE_INFINITY)).toEqual([138, 66, 19]);
    const scale = cellColourScale([0.3, 0.6, 1.2], 1);
    expect(scale.lo).toBe(0.3);
    expect(scale.top).toBe(1.2);
    expect(scale.colour(1)).toEqual(utilisationRgb(1));
    expect(scale.colour(1.2)).toEqual(utilisationRgb(1.2));
  });
});

describe('drawn into a PDF', () => {
  it('reads back with its axis titles, tick numbers, rule label and key', async () => {
    const doc = new PDFDocument({ size: 'A4', margin: 50 });
    registerWorkSans(doc);
    const chunks: Buffer[] = [];
    const done = new Promise<Buffer>((resolve) => {
      doc.on('data', (c: Buffer) => chunks.push(c));
      doc.on('end', () => resolve(Buffer.concat(chunks)));
    });
    const xs = Array.from({ length: 81 }, (_, i) => 1 + (1.6 * i) / 80);
    const bare = xs.map((f) => 0.05 / Math.sqrt((1 - (f / 1.87) ** 2) ** 2 + (2 * 0.005 * (f / 1.87)) ** 2));
    drawLinePlot(doc, { x: 50, y: 60, width: 495, height: 210 }, {
      xTitle: 'frequency of the force [Hz]',
      yTitle: 'peak acceleration [m/s²]',
      series: [{ label: 'bare structure', x: xs, y: bare, colour: '#8b94a1' }],
      rules: [{ value: 1, label: 'comfort limit 1.000 m/s²' }],
      bands: [[1, 2.6]],
    });
    drawCellMap(doc, { x: 50, y: 320, width: 495, height: 240 }, {
      xs: [1.6, 1.7, 1.8, 1.9, 2.0],
      ys: [2, 4, 8, 16],
      values: [[1.3, 0.8, 0.6, 0.7], [1.1, 0.6, 0.4, 0.5], [0.9, 0.5, 0.3, 0.4], [1.1, 0.6, 0.4, 0.5], [1.3, 0.8, 0.6, 0.7]],
      limit: 1,
      xTitle: 'structure frequency [Hz]',
      yTitle: 'damper damping ratio [%]',
      valueTitle: 'peak acceleration [m/s²]',
      marker: { x: 1.8, y: 8 },
    });
    doc.end();
    const parser = new PDFParse({ data: new Uint8Array(await done) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    for (const expected of ['frequency of the force [Hz]', 'peak acceleration [m/s²]', 'structure frequency [Hz]', 'damper damping ratio [%]', 'comfort limit 1.000 m/s²', 'bare structure', 'loaded band', 'limit 1', '2.6', '1.8']) {
      expect(text).toContain(expected);
    }
  });
});
