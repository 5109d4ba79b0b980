/**
 * Chart.js set up once for Stillspan's plots: only the parts the line plots use are registered (so the bundle
 * stays small), Work Sans and the ink colours for text, and a series palette drawn from tide, ember and ink.
 */
import { CategoryScale, Chart, Filler, Legend, LinearScale, LineElement, PointElement, Tooltip, type TooltipItem } from 'chart.js';

Chart.register(LinearScale, CategoryScale, PointElement, LineElement, Legend, Tooltip, Filler);
Chart.defaults.font.family = '"Work Sans", system-ui, sans-serif';
Chart.defaults.font.size = 12;
Chart.defaults.color = '#3b4553';
Chart.defaults.borderColor = '#d6cfc0';

/** Series colours in order: tide, ember, ink and their lighter or darker kin, told apart also by dash pattern. */
export const seriesColours = ['#0f5751', '#c2621f', '#3b4553', '#1f7a72', '#8a4213', '#596373', '#a9d3ca', '#a8521a'];
export const seriesDashes: number[][] = [[], [6, 4], [2, 3], [10, 3, 2, 3], [], [6, 4], [2, 3], [10, 3, 2, 3]];

export function seriesStyle(index: number) {
  return {
    borderColor: seriesColours[index % seriesColours.length],
    backgroundColor: seriesColours[index % seriesColours.length],
    borderDash: seriesDashes[index % seriesDashes.length],
  };
}

/** A number for an axis tick: short, without trailing zeros, exponent form only for very small or large values. */
export function formatTick(value: number): string {
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude < 1e-3 || magnitude >= 1e5) return value.toExponential(1);
  return Number(value.toPrecision(3)).toString();
}

/** Options every line plot shares: it fills its box and draws at once. */
export const plotBaseOptions = { responsive: true, maintainAspectRatio: false, animation: false } as const;

/** Hover picks the nearest point along the horizontal axis. */
export const nearestAlongX = { mode: 'nearest', axis: 'x', intersect: false } as const;

/** The legend of a line plot: below the plot, short swatches. */
export const bottomLegend = { position: 'bottom', labels: { boxWidth: 24 } } as const;

/** An axis title. */
export function axisTitle(text: string) {
  return { display: true, text };
}

/** Axis ticks written by `formatTick`. */
export const numberTicks = { callback: (value: string | number) => formatTick(Number(value)) };

/** A tooltip line: the series name and its value written by `formatTick`. */
export function seriesValueLabel(item: TooltipItem<'line'>): string {
  return `${item.dataset.label}: ${formatTick(item.parsed.y ?? 0)}`;
}
