import { Line } from 'react-chartjs-2';
import { ChartFigure } from './chart-figure';
import { axisTitle, bottomLegend, formatTick, nearestAlongX, numberTicks, plotBaseOptions, seriesStyle } from './chart-theme';

export interface DecayChartProps {
  envelope: { timesS: readonly number[]; values: readonly number[] };
  fit?: { timesS: readonly number[]; values: readonly number[] } | null;
  description: string;
}

const points = (x: readonly number[], y: readonly number[]) => x.map((value, i) => ({ x: value, y: y[i] }));

/** A free decay's envelope and the exponential fitted to it. */
export default function DecayChart({ envelope, fit, description }: DecayChartProps) {
  return (
    <ChartFigure description={description}>
      <Line
        role="img"
        aria-label={description}
        data={{
          datasets: [
            { label: 'Envelope (band-passed)', data: points(envelope.timesS, envelope.values), ...seriesStyle(0), borderWidth: 1.5, pointRadius: 0, tension: 0 },
            ...(fit ? [{ label: 'Fitted decay a₀ e^(−ζωt)', data: points(fit.timesS, fit.values), ...seriesStyle(1), borderWidth: 2, pointRadius: 0, tension: 0 }] : []),
          ],
        }}
        options={{
          ...plotBaseOptions,
          parsing: false,
          interaction: nearestAlongX,
          plugins: {
            legend: bottomLegend,
            tooltip: { callbacks: { title: (items) => (items[0] ? `t = ${formatTick(items[0].parsed.x ?? 0)} s` : '') } },
          },
          scales: {
            x: { type: 'linear', title: axisTitle('time [s]'), ticks: numberTicks },
            y: { type: 'linear', title: axisTitle('envelope [m/s²]'), ticks: numberTicks },
          },
        }}
      />
    </ChartFigure>
  );
}
