import { Scatter } from 'react-chartjs-2';
import type { Plugin } from 'chart.js';
import { formatTick } from './chart-theme';
import { utilisationColour } from './utilisation-scale';

export interface HeatMapChartProps {
  /** Column positions (horizontal axis), ascending and evenly spaced. */
  xs: ArrayLike<number>;
  /** Row positions (vertical axis), ascending and evenly spaced. */
  ys: ArrayLike<number>;
  /** values[ix * ys.length + iy]: the value of the cell at xs[ix], ys[iy], in the display unit. */
  values: ArrayLike<number>;
  /** The value at which a cell is "at the limit" (utilisation 1); colours are read as value / limit. */
  limit: number;
  /** The design point, drawn as a ring. */
  marker?: { x: number; y: number } | null;
  /** A rectangle to outline (the detuning band × damping tolerance). */
  region?: { x0: number; x1: number; y0: number; y1: number } | null;
  xAxisLabel: string;
  yAxisLabel: string;
  valueLabel: string;
  /** Shows a y value on the axis and in the tooltip (e.g. a ratio as a percentage). */
  formatY?: (value: number) => string;
  description: string;
}

interface CellOptions {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  values: ArrayLike<number>;
  colour: (value: number) => string;
  marker: { x: number; y: number } | null;
  region: { x0: number; x1: number; y0: number; y1: number } | null;
}

/** Paints one rectangle per cell, centred on its (x, y), edge to edge with its neighbours; then the region and the marker. */
const cells: Plugin<'scatter'> = {
  id: 'stillspanCells',
  beforeDatasetsDraw(chart, _args, options) {
    const { xs, ys, values, colour, marker, region } = options as unknown as CellOptions;
    if (!xs || xs.length === 0 || ys.length === 0) return;
    const { ctx, chartArea, scales } = chart;
    const nx = xs.length;
    const ny = ys.length;
    const half = (arr: ArrayLike<number>, i: number) => {
      const prev = i > 0 ? arr[i - 1] : arr[i] - (arr.length > 1 ? arr[1] - arr[0] : 1);
      const next = i < arr.length - 1 ? arr[i + 1] : arr[i] + (arr.length > 1 ? arr[i] - arr[i - 1] : 1);
      return [(prev + arr[i]) / 2, (arr[i] + next) / 2] as const;
    };
    ctx.save();
    ctx.beginPath();
    ctx.rect(chartArea.left, chartArea.top, chartArea.right - chartArea.left, chartArea.bottom - chartArea.top);
    ctx.clip();
    for (let ix = 0; ix < nx; ix++) {
      const [xa, xb] = half(xs, ix);
      const px0 = Math.floor(scales.x.getPixelForValue(xa));
      const px1 = Math.ceil(scales.x.getPixelForValue(xb));
      for (let iy = 0; iy < ny; iy++) {
        const [ya, yb] = half(ys, iy);
        const py0 = Math.floor(scales.y.getPixelForValue(yb));
        const py1 = Math.ceil(scales.y.getPixelForValue(ya));
        ctx.fillStyle = colour(values[ix * ny + iy]);
        ctx.fillRect(px0, py0, px1 - px0, py1 - py0);
      }
    }
    if (region) {
      ctx.strokeStyle = '#1b222c';
      ctx.lineWidth = 1.5;
      ctx.setLineDash([5, 3]);
      const rx0 = scales.x.getPixelForValue(region.x0);
      const rx1 = scales.x.getPixelForValue(region.x1);
      const ry0 = scales.y.getPixelForValue(region.y1);
      const ry1 = scales.y.getPixelForValue(region.y0);
      ctx.strokeRect(rx0, ry0, rx1 - rx0, ry1 - ry0);
      ctx.setLineDash([]);
    }
    if (marker) {
      const mx = scales.x.getPixelForValue(marker.x);
      const my = scales.y.getPixelForValue(marker.y);
      ctx.lineWidth = 2.5;
      ctx.strokeStyle = '#fffdf8';
      ctx.beginPath();
      ctx.arc(mx, my, 7, 0, 2 * Math.PI);
      ctx.stroke();
      ctx.lineWidth = 1.25;
      ctx.strokeStyle = '#1b222c';
      ctx.beginPath();
      ctx.arc(mx, my, 7, 0, 2 * Math.PI);
      ctx.stroke();
      ctx.beginPath();
      ctx.moveTo(mx - 3, my);
      ctx.lineTo(mx + 3, my);
      ctx.moveTo(mx, my - 3);
      ctx.lineTo(mx, my + 3);
      ctx.stroke();
    }
    ctx.restore();
  },
};

/**
 * A map of values over two parameters, drawn as edge-to-edge cells in Stillspan's utilisation scale: tide inside the
 * limit (deepest at the map's least value), the paper colour at the limit, ember beyond it. Hovering a cell reads its
 * value.
 */
export default function HeatMapChart({
  xs,
  ys,
  values,
  limit,
  marker = null,
  region = null,
  xAxisLabel,
  yAxisLabel,
  valueLabel,
  formatY = formatTick,
  description,
}: HeatMapChartProps) {
  const nx = xs.length;
  const ny = ys.length;
  const points: { x: number; y: number; v: number }[] = [];
  for (let ix = 0; ix < nx; ix++) for (let iy = 0; iy < ny; iy++) points.push({ x: xs[ix], y: ys[iy], v: values[ix * ny + iy] });
  const scale = cellScale(values, limit);
  const dx = nx > 1 ? (xs[1] - xs[0]) / 2 : 0.5;
  const dy = ny > 1 ? (ys[1] - ys[0]) / 2 : 0.5;
  return (
    <figure className="flex flex-col gap-2">
      <div className="relative h-80 w-full">
        <Scatter
          role="img"
          aria-label={description}
          plugins={[cells]}
          data={{ datasets: [{ label: valueLabel, data: points, pointRadius: 0, pointHoverRadius: 0, pointHitRadius: 4 }] }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            interaction: { mode: 'nearest', intersect: true },
            plugins: {
              ...({ stillspanCells: { xs, ys, values, colour: scale.colour, marker, region } } as object),
              legend: { display: false },
              tooltip: {
                displayColors: false,
                callbacks: {
                  title: (items) => (items[0] ? `${xAxisLabel}: ${formatTick(items[0].parsed.x ?? 0)} · ${yAxisLabel}: ${formatY(items[0].parsed.y ?? 0)}` : ''),
                  label: (item) => {
                    const v = (item.raw as { v: number }).v;
                    return `${valueLabel}: ${formatTick(v)} (${formatTick((v / limit) * 100)} % of the limit)`;
                  },
                },
              },
            },
            scales: {
              x: {
                type: 'linear',
                min: nx ? xs[0] - dx : undefined,
                max: nx ? xs[nx - 1] + dx : undefined,
                grid: { display: false },
                title: { display: true, text: xAxisLabel },
                ticks: { callback: (value) => formatTick(Number(value)) },
              },
              y: {
                type: 'linear',
                min: ny ? ys[0] - dy : undefined,
                max: ny ? ys[ny - 1] + dy : undefined,
                grid: { display: false },
                title: { display: true, text: yAxisLabel },
                ticks: { callback: (value) => formatY(Number(value)) },
              },
            },
          }}
        />
      </div>
      <ScaleLegend scale={scale} unitLabel={valueLabel} />
      <figcaption className="text-caption text-ink-muted">{description}</figcaption>
    </figure>
  );
}

interface CellScale {
  lo: number;
  /** Largest value at or below the limit (the end of the tide part). */
  hiBelow: number;
  top: number;
  limit: number;
  colour: (value: number) => string;
}

/**
 * Colours of the cells: below the limit the tide part of the scale is spread over the map's own values (so a map far
 * inside the limit still shows its shape), reaching the paper colour only at the limit itself; above the limit the
 * ember part by utilisation.
 */
function cellScale(values: ArrayLike<number>, limit: number): CellScale {
  let lo = Infinity;
  let top = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (Number.isFinite(values[i])) {
      lo = Math.min(lo, values[i]);
      top = Math.max(top, values[i]);
    }
  }
  if (!Number.isFinite(lo)) lo = top = 0;
  const crosses = top > limit;
  const hiBelow = crosses ? limit : top;
  const span = hiBelow - lo;
  const colour = (value: number) => {
    if (value > limit) return utilisationColour(value / limit);
    const t = span > 0 ? Math.min(Math.max((value - lo) / span, 0), 1) : 0;
    return utilisationColour(crosses ? t : t * 0.85);
  };
  return { lo, hiBelow, top, limit, colour };
}

/** The scale's key: the tide part from the map's least value, the ember part above the limit when the map reaches it. */
function ScaleLegend({ scale, unitLabel }: { scale: CellScale; unitLabel: string }) {
  const tide = Array.from({ length: 9 }, (_, i) => scale.colour(scale.lo + ((scale.hiBelow - scale.lo) * i) / 8)).join(', ');
  const crosses = scale.top > scale.limit;
  const ember = crosses ? Array.from({ length: 9 }, (_, i) => scale.colour(scale.limit + ((scale.top - scale.limit) * i) / 8)).join(', ') : '';
  return (
    <div className="flex max-w-lg flex-col gap-1 text-caption text-ink-muted">
      <div className="flex h-3 overflow-hidden rounded-pill border border-paper-line" aria-hidden="true">
        <div className="flex-1" style={{ background: `linear-gradient(to right, ${tide})` }} />
        {crosses ? <div className="flex-1" style={{ background: `linear-gradient(to right, ${ember})` }} /> : null}
      </div>
      <div className="flex justify-between gap-2">
        <span>{formatTick(scale.lo)}</span>
        <span>{crosses ? `limit ${formatTick(scale.limit)}` : `${formatTick(scale.hiBelow)} (limit ${formatTick(scale.limit)})`}</span>
        {crosses ? <span>{formatTick(scale.top)}</span> : null}
      </div>
      <span>{unitLabel}: tide below the comfort limit, ember above it</span>
    </div>
  );
}
