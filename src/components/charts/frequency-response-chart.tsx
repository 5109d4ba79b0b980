import { Line } from 'react-chartjs-2';
import type { Plugin } from 'chart.js';
import { ChartFigure } from './chart-figure';
import { axisTitle, bottomLegend, formatTick, nearestAlongX, numberTicks, plotBaseOptions, seriesStyle, seriesValueLabel } from './chart-theme';

export interface FrequencySeries {
  label: string;
  /** One value per frequency of `frequenciesHz`, already in the display unit. */
  values: ArrayLike<number>;
  /** Drawn thin and pale (a reference such as the bare structure) rather than as a main line. */
  muted?: boolean;
  /** Series colour index in the shared palette (default: its position). */
  colourIndex?: number;
  /** Its own frequencies, when they differ from the chart's (series sampled at different points). */
  frequenciesHz?: ArrayLike<number>;
}

export interface FrequencyResponseChartProps {
  frequenciesHz: ArrayLike<number>;
  series: readonly FrequencySeries[];
  /** A horizontal limit (the comfort limit, the hardware travel), in the display unit. */
  limit?: { value: number; label: string } | null;
  /** Shaded frequency bands (the pacing bands the load case loads), Hz. */
  bandsHz?: readonly (readonly [number, number])[];
  valueAxisLabel: string;
  description: string;
  height?: 'short' | 'tall';
}

/** Draws the loaded bands as a pale tide wash behind the lines, and the limit as an ember rule with its label. */
const overlays: Plugin<'line'> = {
  id: 'stillspanResponseOverlays',
  beforeDatasetsDraw(chart, _args, options) {
    const { ctx, chartArea, scales } = chart;
    const opts = options as { bands?: readonly (readonly [number, number])[] };
    if (!opts.bands?.length) return;
    ctx.save();
    ctx.fillStyle = 'rgba(169, 211, 202, 0.22)';
    for (const [lo, hi] of opts.bands) {
      const x0 = Math.max(scales.x.getPixelForValue(lo), chartArea.left);
      const x1 = Math.min(scales.x.getPixelForValue(hi), chartArea.right);
      if (x1 > x0) ctx.fillRect(x0, chartArea.top, x1 - x0, chartArea.bottom - chartArea.top);
    }
    ctx.restore();
  },
  afterDatasetsDraw(chart, _args, options) {
    const { ctx, chartArea, scales } = chart;
    const opts = options as { limit?: { value: number; label: string } | null };
    if (!opts.limit) return;
    const y = scales.y.getPixelForValue(opts.limit.value);
    if (y < chartArea.top || y > chartArea.bottom) return;
    ctx.save();
    ctx.strokeStyle = '#a8521a';
    ctx.lineWidth = 1.5;
    ctx.setLineDash([8, 3, 2, 3]);
    ctx.beginPath();
    ctx.moveTo(chartArea.left, y);
    ctx.lineTo(chartArea.right, y);
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.fillStyle = '#8a4213';
    ctx.font = '600 11px "Work Sans", system-ui, sans-serif';
    ctx.textAlign = 'right';
    ctx.textBaseline = 'bottom';
    ctx.fillText(opts.limit.label, chartArea.right - 4, y - 3);
    ctx.restore();
  },
};

/** Response magnitudes over frequency: several series on one linear frequency axis, with loaded bands and a limit. */
export default function FrequencyResponseChart({
  frequenciesHz,
  series,
  limit,
  bandsHz,
  valueAxisLabel,
  description,
  height = 'tall',
}: FrequencyResponseChartProps) {
  let top = limit ? limit.value : 0;
  for (const entry of series) for (let i = 0; i < entry.values.length; i++) if (entry.values[i] > top) top = entry.values[i];
  return (
    <ChartFigure description={description} heightClass={height === 'tall' ? 'h-80' : 'h-60'}>
      <Line
        role="img"
        aria-label={description}
        plugins={[overlays]}
        data={{
          datasets: series.map((entry, index) => {
            const style = seriesStyle(entry.colourIndex ?? index);
            const xs = entry.frequenciesHz ?? frequenciesHz;
            return {
              label: entry.label,
              data: Array.from({ length: xs.length }, (_, i) => ({ x: xs[i], y: entry.values[i] })),
              ...style,
              borderColor: entry.muted ? '#8b94a1' : style.borderColor,
              backgroundColor: entry.muted ? '#8b94a1' : style.backgroundColor,
              borderDash: entry.muted ? [3, 3] : style.borderDash,
              borderWidth: entry.muted ? 1.25 : 2.25,
              pointRadius: 0,
              tension: 0,
            };
          }),
        }}
        options={{
          ...plotBaseOptions,
          parsing: false,
          normalized: true,
          interaction: nearestAlongX,
          plugins: {
            // Chart.js types know no options of our own plugin id.
            ...({ stillspanResponseOverlays: { bands: bandsHz ?? [], limit: limit ?? null } } as object),
            legend: bottomLegend,
            tooltip: {
              callbacks: {
                title: (items) => (items[0] ? `${formatTick(items[0].parsed.x ?? 0)} Hz` : ''),
                label: seriesValueLabel,
              },
            },
          },
          scales: {
            x: {
              type: 'linear',
              min: frequenciesHz.length ? frequenciesHz[0] : undefined,
              max: frequenciesHz.length ? frequenciesHz[frequenciesHz.length - 1] : undefined,
              title: axisTitle('frequency [Hz]'),
              ticks: numberTicks,
            },
            y: {
              min: 0,
              suggestedMax: top * 1.08,
              title: axisTitle(valueAxisLabel),
              ticks: numberTicks,
            },
          },
        }}
      />
    </ChartFigure>
  );
}
