import { Chart, LogarithmicScale, ScatterController } from 'chart.js';
import { Line } from 'react-chartjs-2';
import { ChartFigure } from './chart-figure';
import { axisTitle, bottomLegend, formatTick, nearestAlongX, numberTicks, plotBaseOptions, seriesStyle } from './chart-theme';

Chart.register(LogarithmicScale, ScatterController);

export interface SpectrumChartProps {
  frequencyHz: readonly number[];
  psd: readonly number[];
  /** The fitted response curve over the fit band, when there is one. */
  fit?: { frequencyHz: readonly number[]; psd: readonly number[] } | null;
  /** The identified peak: a marker on the spectrum. */
  peak?: { frequencyHz: number; psd: number } | null;
  description: string;
}

const points = (x: readonly number[], y: readonly number[]) => x.map((value, i) => ({ x: value, y: y[i] })).filter((p) => p.y > 0);

/** A power spectral density on a logarithmic axis, with the fitted curve and the peak. */
export default function SpectrumChart({ frequencyHz, psd, fit, peak, description }: SpectrumChartProps) {
  const datasets = [
    { label: 'Spectrum (Welch PSD)', data: points(frequencyHz, psd), ...seriesStyle(0), borderWidth: 1.5, pointRadius: 0, tension: 0 },
    ...(fit ? [{ label: 'Fitted single mode', data: points(fit.frequencyHz, fit.psd), ...seriesStyle(1), borderWidth: 2, pointRadius: 0, tension: 0 }] : []),
    ...(peak
      ? [{ label: 'Peak', data: [{ x: peak.frequencyHz, y: peak.psd }], ...seriesStyle(2), borderDash: [], showLine: false, pointRadius: 5, pointStyle: 'triangle' as const }]
      : []),
  ];
  return (
    <ChartFigure description={description}>
      <Line
        role="img"
        aria-label={description}
        data={{ datasets }}
        options={{
          ...plotBaseOptions,
          parsing: false,
          interaction: nearestAlongX,
          plugins: {
            legend: bottomLegend,
            tooltip: {
              callbacks: {
                title: (items) => (items[0] ? `${formatTick(items[0].parsed.x ?? 0)} Hz` : ''),
                label: (item) => `${item.dataset.label}: ${formatTick(item.parsed.y ?? 0)} (m/s²)²/Hz`,
              },
            },
          },
          scales: {
            x: { type: 'linear', title: axisTitle('frequency [Hz]'), ticks: numberTicks },
            y: { type: 'logarithmic', title: axisTitle('PSD [(m/s²)²/Hz]'), ticks: numberTicks },
          },
        }}
      />
    </ChartFigure>
  );
}
