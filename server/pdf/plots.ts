/**
 * Plots drawn as vector graphics into a pdfkit document: a line plot (response curves over frequency, a time
 * history) and a cell map (the robustness map), each with framed axes, ticks at "nice" numbers with their values, axis
 * titles with units and a key. The data are drawn as given: the caller passes the same numbers the product's pages
 * plot, so a filed report and the screen cannot disagree.
 *
 * Tick choice follows Heckbert's "nice numbers" (P. S. Heckbert, "Nice numbers for graph labels", Graphics Gems,
 * 1990): a step of 1, 2 or 5 × 10^k near range / wanted intervals, with the axis widened to whole steps.
 */
import { FONT_REGULAR, FONT_SEMIBOLD, latin } from './fonts';

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export type Rgb = readonly [number, number, number];

/** Ink and paper of the product's palette (tailwind.config.ts), for print. */
export const plotColours = {
  ink: '#1b222c',
  inkMuted: '#5b6472',
  grid: '#dcd8cf',
  frame: '#8b94a1',
  band: '#e3efec',
  withDamper: '#176a63',
  bare: '#8b94a1',
  limit: '#a8521a',
  accent: '#c2621f',
} as const;

// ---------- scales and ticks ----------

/**
 * The nice number near `x` (> 0): 1, 2, 5 or 10 × 10^k. `round` picks the nearest one (a step), otherwise the
 * smallest one not below x (a range). Heckbert 1990.
 */
export function niceNumber(x: number, round: boolean): number {
  if (!(x > 0) || !Number.isFinite(x)) throw new RangeError(`niceNumber: x must be a finite number greater than 0 (got ${x})`);
  const exponent = Math.floor(Math.log10(x));
  const power = 10 ** exponent;
  const fraction = x / power;
  let nice: number;
  if (round) nice = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
  else nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
  return nice * power;
}

export interface NiceTicks {
  /** The axis' ends: whole steps around the data. */
  min: number;
  max: number;
  step: number;
  /** The tick values from min to max. */
  values: number[];
  /** Decimals that show every tick exactly. */
  decimals: number;
}

/**
 * Ticks for data from `lo` to `hi`: about `targetCount` intervals of a nice step, the axis widened outwards to whole
 * steps (after Heckbert 1990). A range of zero width is widened around its value.
 */
export function niceTicks(lo: number, hi: number, targetCount = 5): NiceTicks {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) throw new RangeError(`niceTicks: the range must be finite (got ${lo} to ${hi})`);
  if (lo > hi) [lo, hi] = [hi, lo];
  if (hi === lo) {
    const half = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= half;
    hi += half;
  }
  // The step is the nice number nearest range / targetCount (Heckbert's rounding; his loose labelling first rounds the
  // range up as well, which can halve the ticks: 0–25.7 s with seven wanted gave a step of 10).
  const step = niceNumber((hi - lo) / Math.max(1, targetCount), true);
  // Snap to the step, with a tolerance for the ends that already lie on it.
  const min = Math.floor(lo / step + 1e-9) * step;
  const max = Math.ceil(hi / step - 1e-9) * step;
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const values: number[] = [];
  for (let i = 0; min + i * step <= max + step * 1e-9; i++) values.push(Number((min + i * step).toFixed(decimals)));
  return { min: Number(min.toFixed(decimals)), max: Number(max.toFixed(decimals)), step, values, decimals };
}

/**
 * Ticks inside [lo, hi] only (the axis keeps the data's own ends): the nice values of a step chosen for the range
 * that lie within it. For axes whose ends are fixed by the data (a frequency band).
 */
export function niceTicksWithin(lo: number, hi: number, targetCount = 5): NiceTicks {
  const loose = niceTicks(lo, hi, targetCount);
  const values = loose.values.filter((v) => v >= lo - loose.step * 1e-9 && v <= hi + loose.step * 1e-9);
  return { ...loose, min: lo, max: hi, values };
}

/** A tick's label: as many decimals as the step needs, a minus sign for negatives, no "-0". */
export function formatTick(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** The affine map of `domain` onto `range` (page coordinates); a domain of zero width maps to the middle. */
export function linearMap(domain: readonly [number, number], range: readonly [number, number]): (value: number) => number {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  if (d1 === d0) return () => (r0 + r1) / 2;
  const k = (r1 - r0) / (d1 - d0);
  return (value) => r0 + (value - d0) * k;
}

/**
 * The path of a series on the page: runs of consecutive finite points, each run a polyline. A null or non-finite value
 * breaks the line (a gap between bands, an unbounded value).
 */
export function polylineRuns(
  xs: ArrayLike<number>,
  ys: ArrayLike<number | null>,
  toPageX: (v: number) => number,
  toPageY: (v: number) => number,
): Array<Array<[number, number]>> {
  const runs: Array<Array<[number, number]>> = [];
  let run: Array<[number, number]> = [];
  const n = Math.min(xs.length, ys.length);
  for (let i = 0; i < n; i++) {
    const y = ys[i];
    if (y === null || !Number.isFinite(y) || !Number.isFinite(xs[i])) {
      if (run.length) runs.push(run);
      run = [];
      continue;
    }
    run.push([toPageX(xs[i]), toPageY(y)]);
  }
  if (run.length) runs.push(run);
  return runs;
}

// ---------- the utilisation colour scale ----------

/**
 * The product's colour scale for a value read against a limit (utilisation = value / limit), the same stops as the
 * pages' scale (src/components/charts/utilisation-scale.ts): deep tide well inside the limit, the paper colour at the
 * limit, ember beyond it.
 */
const utilisationStops: ReadonlyArray<{ u: number; rgb: Rgb }> = [
  { u: 0, rgb: [0x08, 0x2f, 0x2c] },
  { u: 0.5, rgb: [0x17, 0x6a, 0x63] },
  { u: 0.85, rgb: [0xa9, 0xd3, 0xca] },
  { u: 1, rgb: [0xf6, 0xf3, 0xec] },
  { u: 1.2, rgb: [0xf8, 0xe0, 0xcc] },
  { u: 1.6, rgb: [0xc2, 0x62, 0x1f] },
  { u: 2.2, rgb: [0x8a, 0x42, 0x13] },
];

export function utilisationRgb(utilisation: number): Rgb {
  const stops = utilisationStops;
  if (!Number.isFinite(utilisation)) return stops[stops.length - 1].rgb;
  if (utilisation <= stops[0].u) return stops[0].rgb;
  for (let i = 1; i < stops.length; i++) {
    if (utilisation <= stops[i].u) {
      const a = stops[i - 1];
      const b = stops[i];
      const t = (utilisation - a.u) / (b.u - a.u);
      return [0, 1, 2].map((k) => Math.round(a.rgb[k] + t * (b.rgb[k] - a.rgb[k]))) as unknown as Rgb;
    }
  }
  return stops[stops.length - 1].rgb;
}

/**
 * Colours of a map's cells, as on the page: below the limit the tide part of the scale spread over the map's own
 * values (a map far inside the limit still shows its shape), reaching the paper colour only at the limit; above it the
 * ember part by utilisation.
 */
export function cellColourScale(values: readonly number[], limit: number): { lo: number; top: number; limit: number; colour: (value: number) => Rgb } {
  let lo = Infinity;
  let top = -Infinity;
  for (const v of values) {
    if (Number.isFinite(v)) {
      lo = Math.min(lo, v);
      top = Math.max(top, v);
    }
  }
  if (!Number.isFinite(lo)) lo = top = 0;
  const crosses = top > limit;
  const hiBelow = crosses ? limit : top;
  const span = hiBelow - lo;
  const colour = (value: number): Rgb => {
    if (!Number.isFinite(value) || value > limit) return utilisationRgb(value / limit);
    const t = span > 0 ? Math.min(Math.max((value - lo) / span, 0), 1) : 0;
    return utilisationRgb(crosses ? t : t * 0.85);
  };
  return { lo, top, limit, colour };
}

// ---------- drawing ----------

const TICK_FONT_SIZE = 7.5;
const TITLE_FONT_SIZE = 8;
const LEFT_GUTTER = 50;
const BOTTOM_GUTTER = 30;

function text(doc: PDFKit.PDFDocument, value: string, x: number, y: number, options: PDFKit.Mixins.TextOptions = {}): void {
  doc.text(latin(value), x, y, { lineBreak: false, ...options });
}

/** Axis titles and tick labels around a plot area; grid lines across it. */
function drawAxes(
  doc: PDFKit.PDFDocument,
  area: Box,
  xTicks: NiceTicks,
  yTicks: NiceTicks,
  toX: (v: number) => number,
  toY: (v: number) => number,
  xTitle: string,
  yTitle: string,
  options: { grid?: boolean; formatY?: (v: number, decimals: number) => string } = {},
): void {
  const grid = options.grid ?? true;
  const formatY = options.formatY ?? formatTick;
  doc.save();
  doc.lineWidth(0.4).strokeColor(plotColours.grid);
  if (grid) {
    for (const v of xTicks.values) doc.moveTo(toX(v), area.y).lineTo(toX(v), area.y + area.height).stroke();
    for (const v of yTicks.values) doc.moveTo(area.x, toY(v)).lineTo(area.x + area.width, toY(v)).stroke();
  }
  doc.restore();
  doc.save();
  doc.lineWidth(0.8).strokeColor(plotColours.frame).rect(area.x, area.y, area.width, area.height).stroke();
  doc.lineWidth(0.6);
  doc.font(FONT_REGULAR).fontSize(TICK_FONT_SIZE).fillColor(plotColours.ink);
  for (const v of xTicks.values) {
    const px = toX(v);
    doc.moveTo(px, area.y + area.height).lineTo(px, area.y + area.height + 3).stroke();
    const label = formatTick(v, xTicks.decimals);
    const w = doc.widthOfString(label);
    text(doc, label, px - w / 2, area.y + area.height + 5);
  }
  for (const v of yTicks.values) {
    const py = toY(v);
    doc.moveTo(area.x - 3, py).lineTo(area.x, py).stroke();
    const label = formatY(v, yTicks.decimals);
    const w = doc.widthOfString(label);
    text(doc, label, area.x - 5 - w, py - TICK_FONT_SIZE / 2 - 0.5);
  }
  doc.font(FONT_SEMIBOLD).fontSize(TITLE_FONT_SIZE).fillColor(plotColours.ink);
  const xw = doc.widthOfString(latin(xTitle));
  text(doc, xTitle, area.x + (area.width - xw) / 2, area.y + area.height + 16);
  // The value axis' title, turned a quarter left, centred on the axis.
  const yw = doc.widthOfString(latin(yTitle));
  const yx = area.x - LEFT_GUTTER + 2;
  const yy = area.y + (area.height + yw) / 2;
  doc.save();
  doc.rotate(-90, { origin: [yx, yy] });
  text(doc, yTitle, yx, yy);
  doc.restore();
  doc.restore();
}

export interface LineSeries {
  label: string;
  x: ArrayLike<number>;
  /** null or a non-finite number: no value there (the line breaks). */
  y: ArrayLike<number | null>;
  colour: string;
  width?: number;
  /** Dash length and gap, pt; none for a solid line. */
  dash?: readonly [number, number];
}

export interface HorizontalRule {
  value: number;
  label: string;
  colour?: string;
}

export interface LinePlotSpec {
  xTitle: string;
  yTitle: string;
  series: readonly LineSeries[];
  /** The horizontal axis' ends (default: the data's). */
  xRange?: readonly [number, number];
  /** Horizontal rules (the comfort limit, the hardware travel), drawn dash-dotted with their label. */
  rules?: readonly HorizontalRule[];
  /** Shaded stretches of the horizontal axis (the bands the load case loads). */
  bands?: ReadonlyArray<readonly [number, number]>;
  /** Points to mark (a peak), with a short label. */
  points?: ReadonlyArray<{ x: number; y: number; label: string; colour?: string }>;
  /** The value axis starts at 0 (default) or fits the data (a signed history). */
  yFromZero?: boolean;
}

/** The plot area inside a line plot's box (axes and key around it). */
export function linePlotArea(box: Box): Box {
  return { x: box.x + LEFT_GUTTER, y: box.y + 6, width: box.width - LEFT_GUTTER - 8, height: box.height - BOTTOM_GUTTER - 6 - 16 };
}

export interface PlotFrame {
  area: Box;
  xTicks: NiceTicks;
  yTicks: NiceTicks;
  /** Data to page coordinates (pdfkit's y grows downwards: larger values map higher up the page). */
  toX: (value: number) => number;
  toY: (value: number) => number;
}

/**
 * The axes of a line plot in `box`: the horizontal axis from the data's (or `xRange`'s) ends with nice ticks inside,
 * the value axis widened to whole nice steps around the data and the rules (from 0 unless `yFromZero` is false).
 */
export function linePlotFrame(box: Box, spec: Pick<LinePlotSpec, 'series' | 'xRange' | 'rules' | 'yFromZero'>): PlotFrame {
  const area = linePlotArea(box);
  let xLo = Infinity;
  let xHi = -Infinity;
  let yLo = Infinity;
  let yHi = -Infinity;
  for (const s of spec.series) {
    for (let i = 0; i < Math.min(s.x.length, s.y.length); i++) {
      const y = s.y[i];
      if (Number.isFinite(s.x[i])) {
        xLo = Math.min(xLo, s.x[i]);
        xHi = Math.max(xHi, s.x[i]);
      }
      if (y !== null && Number.isFinite(y)) {
        yLo = Math.min(yLo, y);
        yHi = Math.max(yHi, y);
      }
    }
  }
  for (const r of spec.rules ?? []) {
    if (Number.isFinite(r.value)) {
      yHi = Math.max(yHi, r.value);
      yLo = Math.min(yLo, r.value);
    }
  }
  if (spec.xRange) [xLo, xHi] = spec.xRange;
  if (!Number.isFinite(xLo)) [xLo, xHi] = [0, 1];
  if (!Number.isFinite(yLo)) [yLo, yHi] = [0, 1];
  const fromZero = spec.yFromZero ?? true;
  if (fromZero) yLo = Math.min(0, yLo);
  const xTicks = niceTicksWithin(xLo, xHi, Math.max(3, Math.round(area.width / 60)));
  // A little headroom, so that a peak or a rule at the top of the data does not sit on the frame.
  const headroom = 0.04 * (yHi - yLo);
  const yTicks = niceTicks(fromZero ? yLo : yLo - headroom, yHi + headroom, Math.max(3, Math.round(area.height / 32)));
  const toX = linearMap([xTicks.min, xTicks.max], [area.x, area.x + area.width]);
  const toY = linearMap([yTicks.min, yTicks.max], [area.y + area.height, area.y]);
  return { area, xTicks, yTicks, toX, toY };
}

/** A line plot in `box`: bands, grid, series, rules, marked points, axes with nice ticks and titles, and a key below. */
export function drawLinePlot(doc: PDFKit.PDFDocument, box: Box, spec: LinePlotSpec): void {
  const cursor = { x: doc.x, y: doc.y };
  const { area, xTicks, yTicks, toX, toY } = linePlotFrame(box, spec);

  doc.save();
  doc.rect(area.x, area.y, area.width, area.height).clip();
  doc.fillColor(plotColours.band);
  for (const [lo, hi] of spec.bands ?? []) {
    const x0 = Math.max(toX(lo), area.x);
    const x1 = Math.min(toX(hi), area.x + area.width);
    if (x1 > x0) doc.rect(x0, area.y, x1 - x0, area.height).fill();
  }
  doc.restore();

  drawAxes(doc, area, xTicks, yTicks, toX, toY, spec.xTitle, spec.yTitle);

  doc.save();
  doc.rect(area.x, area.y, area.width, area.height).clip();
  doc.lineJoin('round').lineCap('round');
  for (const s of spec.series) {
    doc.lineWidth(s.width ?? 1.4).strokeColor(s.colour);
    if (s.dash) doc.dash(s.dash[0], { space: s.dash[1] });
    else doc.undash();
    for (const run of polylineRuns(s.x, s.y, toX, toY)) {
      if (run.length === 1) {
        doc.circle(run[0][0], run[0][1], 0.8).fill(s.colour);
        continue;
      }
      doc.moveTo(run[0][0], run[0][1]);
      for (let i = 1; i < run.length; i++) doc.lineTo(run[i][0], run[i][1]);
      doc.stroke();
    }
  }
  doc.undash();
  for (const r of spec.rules ?? []) {
    const py = toY(r.value);
    if (py < area.y - 0.5 || py > area.y + area.height + 0.5) continue;
    doc.lineWidth(1.1).strokeColor(r.colour ?? plotColours.limit).dash(6, { space: 2.5 });
    doc.moveTo(area.x, py).lineTo(area.x + area.width, py).stroke();
    doc.undash();
    doc.font(FONT_SEMIBOLD).fontSize(7.5).fillColor(r.colour ?? plotColours.limit);
    const w = doc.widthOfString(latin(r.label));
    // Above the rule, unless that leaves the plot area.
    const ty = py - 10 < area.y ? py + 2 : py - 10;
    text(doc, r.label, area.x + area.width - w - 4, ty);
  }
  for (const p of spec.points ?? []) {
    const px = toX(p.x);
    const py = toY(p.y);
    doc.lineWidth(1).strokeColor(p.colour ?? plotColours.ink).circle(px, py, 2.6).stroke();
    doc.font(FONT_REGULAR).fontSize(7).fillColor(p.colour ?? plotColours.ink);
    const w = doc.widthOfString(latin(p.label));
    const tx = Math.min(Math.max(px + 5, area.x + 2), area.x + area.width - w - 2);
    text(doc, p.label, tx, Math.max(py - 11, area.y + 2));
  }
  doc.restore();

  // The key, under the axis title.
  doc.save();
  let kx = area.x;
  const ky = box.y + box.height - 9;
  doc.font(FONT_REGULAR).fontSize(7.5);
  const entries: Array<{ label: string; colour: string; dash?: readonly [number, number]; width: number; fill?: boolean }> = spec.series.map((s) => ({
    label: s.label,
    colour: s.colour,
    dash: s.dash,
    width: s.width ?? 1.4,
  }));
  for (const r of spec.rules ?? []) entries.push({ label: r.label, colour: r.colour ?? plotColours.limit, dash: [6, 2.5], width: 1.1 });
  if (spec.bands?.length) entries.push({ label: 'loaded band', colour: plotColours.band, width: 0, fill: true });
  for (const e of entries) {
    if (e.fill) doc.rect(kx, ky - 1, 16, 7).fill(e.colour);
    else {
      doc.lineWidth(e.width).strokeColor(e.colour);
      if (e.dash) doc.dash(e.dash[0], { space: e.dash[1] });
      doc.moveTo(kx, ky + 2.5).lineTo(kx + 16, ky + 2.5).stroke();
      doc.undash();
    }
    doc.fillColor(plotColours.ink);
    text(doc, e.label, kx + 20, ky - 1);
    kx += 20 + doc.widthOfString(latin(e.label)) + 12;
  }
  doc.restore();
  doc.x = cursor.x;
  doc.y = cursor.y;
}

export interface CellMapSpec {
  /** Column positions (horizontal axis), ascending. */
  xs: readonly number[];
  /** Row positions (vertical axis), ascending. */
  ys: readonly number[];
  /** values[ix][iy]: the value at xs[ix], ys[iy]. */
  values: ReadonlyArray<readonly number[]>;
  /** The value at which a cell is at the limit (utilisation 1). */
  limit: number;
  xTitle: string;
  yTitle: string;
  /** The key's title (the value and its unit). */
  valueTitle: string;
  /** The design point, drawn as a ring with a cross. */
  marker?: { x: number; y: number } | null;
  /** A rectangle to outline (the detuning band × damping tolerance); with y0 = y1, the lines x = x0 and x = x1. */
  region?: { x0: number; x1: number; y0: number; y1: number } | null;
  /** Decimals of the key's numbers (default 3 significant figures of the largest). */
  formatValue?: (value: number) => string;
}

/** Cell edges: halfway to each neighbour, the end cells as wide as their inner half doubled. */
export function cellEdges(positions: readonly number[]): number[] {
  const n = positions.length;
  if (n === 0) return [];
  if (n === 1) return [positions[0] - 0.5, positions[0] + 0.5];
  const edges = [positions[0] - (positions[1] - positions[0]) / 2];
  for (let i = 0; i + 1 < n; i++) edges.push((positions[i] + positions[i + 1]) / 2);
  edges.push(positions[n - 1] + (positions[n - 1] - positions[n - 2]) / 2);
  return edges;
}

const KEY_HEIGHT = 34;

/** A cell map in `box`: edge-to-edge cells in the utilisation scale, the region, the marker, axes, and a colour key. */
export function drawCellMap(doc: PDFKit.PDFDocument, box: Box, spec: CellMapSpec): void {
  const cursor = { x: doc.x, y: doc.y };
  const area: Box = { x: box.x + LEFT_GUTTER, y: box.y + 6, width: box.width - LEFT_GUTTER - 8, height: box.height - BOTTOM_GUTTER - 6 - KEY_HEIGHT };
  const xEdges = cellEdges(spec.xs);
  const yEdges = cellEdges(spec.ys);
  const xLo = xEdges[0] ?? 0;
  const xHi = xEdges[xEdges.length - 1] ?? 1;
  const yLo = yEdges[0] ?? 0;
  const yHi = yEdges[yEdges.length - 1] ?? 1;
  const toX = linearMap([xLo, xHi], [area.x, area.x + area.width]);
  const toY = linearMap([yLo, yHi], [area.y + area.height, area.y]);
  const flat = spec.values.flatMap((row) => [...row]);
  const scale = cellColourScale(flat, spec.limit);

  doc.save();
  doc.rect(area.x, area.y, area.width, area.height).clip();
  for (let ix = 0; ix < spec.xs.length; ix++) {
    const x0 = toX(xEdges[ix]);
    const x1 = toX(xEdges[ix + 1]);
    for (let iy = 0; iy < spec.ys.length; iy++) {
      const y0 = toY(yEdges[iy + 1]);
      const y1 = toY(yEdges[iy]);
      // A quarter point of overlap hides the hairlines a viewer's anti-aliasing draws between abutting cells.
      doc.rect(x0, y0, x1 - x0 + 0.25, y1 - y0 + 0.25).fill([...scale.colour(spec.values[ix]?.[iy] ?? NaN)]);
    }
  }
  if (spec.region) {
    const { x0, x1, y0, y1 } = spec.region;
    doc.lineWidth(1.1).strokeColor(plotColours.ink).dash(4, { space: 2.5 });
    if (y1 > y0) doc.rect(toX(x0), toY(y1), toX(x1) - toX(x0), toY(y0) - toY(y1)).stroke();
    else {
      // No height (no tolerance on the vertical quantity): the horizontal band's edges across the whole map.
      doc.moveTo(toX(x0), area.y).lineTo(toX(x0), area.y + area.height).stroke();
      doc.moveTo(toX(x1), area.y).lineTo(toX(x1), area.y + area.height).stroke();
    }
    doc.undash();
  }
  if (spec.marker) {
    const mx = toX(spec.marker.x);
    const my = toY(spec.marker.y);
    doc.lineWidth(2.2).strokeColor('#fffdf8').circle(mx, my, 5).stroke();
    doc.lineWidth(1).strokeColor(plotColours.ink).circle(mx, my, 5).stroke();
    doc.moveTo(mx - 2.5, my).lineTo(mx + 2.5, my).moveTo(mx, my - 2.5).lineTo(mx, my + 2.5).stroke();
  }
  doc.restore();

  const xTicks = niceTicksWithin(xLo, xHi, Math.max(3, Math.round(area.width / 60)));
  const yTicks = niceTicksWithin(yLo, yHi, Math.max(3, Math.round(area.height / 32)));
  drawAxes(doc, area, xTicks, yTicks, toX, toY, spec.xTitle, spec.yTitle, { grid: false });

  // The key: a bar of the scale from the least value to the largest, the limit marked where the colours turn.
  const keyY = box.y + box.height - KEY_HEIGHT + 6;
  const keyX = area.x;
  const keyW = Math.min(area.width, 300);
  const lo = scale.lo;
  const top = Math.max(scale.top, lo + 1e-12);
  const steps = 60;
  doc.save();
  for (let i = 0; i < steps; i++) {
    const v = lo + ((top - lo) * (i + 0.5)) / steps;
    doc.rect(keyX + (keyW * i) / steps, keyY, keyW / steps + 0.25, 8).fill([...scale.colour(v)]);
  }
  doc.lineWidth(0.5).strokeColor(plotColours.frame).rect(keyX, keyY, keyW, 8).stroke();
  const format = spec.formatValue ?? ((v: number) => String(Number(v.toPrecision(3))));
  const toKey = linearMap([lo, top], [keyX, keyX + keyW]);
  doc.font(FONT_REGULAR).fontSize(TICK_FONT_SIZE).fillColor(plotColours.ink);
  const labels: Array<{ v: number; text: string }> = [{ v: lo, text: format(lo) }, { v: top, text: format(top) }];
  if (spec.limit > lo && spec.limit < top) labels.push({ v: spec.limit, text: `limit ${format(spec.limit)}` });
  let lastRight = -Infinity;
  for (const l of labels.sort((a, b) => a.v - b.v)) {
    const px = toKey(l.v);
    doc.lineWidth(0.6).strokeColor(plotColours.ink).moveTo(px, keyY + 8).lineTo(px, keyY + 11).stroke();
    const w = doc.widthOfString(l.text);
    const tx = Math.min(Math.max(px - w / 2, lastRight + 4), keyX + keyW - w);
    text(doc, l.text, tx, keyY + 12);
    lastRight = tx + w;
  }
  const limitNote = scale.top > spec.limit ? 'tide below the comfort limit, ember above it' : `all cells below the comfort limit of ${format(spec.limit)}`;
  doc.font(FONT_SEMIBOLD).fontSize(TITLE_FONT_SIZE);
  text(doc, spec.valueTitle, keyX + keyW + 10, keyY - 1);
  doc.font(FONT_REGULAR).fontSize(7.5).fillColor(plotColours.inkMuted);
  text(doc, limitNote, keyX + keyW + 10, keyY + 9, { width: box.x + box.width - (keyX + keyW + 10), lineBreak: true });
  doc.restore();
  doc.x = cursor.x;
  doc.y = cursor.y;
}
