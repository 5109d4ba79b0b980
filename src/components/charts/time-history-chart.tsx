import { Line } from 'react-chartjs-2';
import { ChartFigure } from './chart-figure';
import { axisTitle, bottomLegend, formatTick, nearestAlongX, numberTicks, plotBaseOptions, seriesStyle, seriesValueLabel } from './chart-theme';

export interface TimeHistorySeries {
  label: string;
  /** One value per time, in the unit named by `valueAxisLabel`. */
  values: ArrayLike<number>;
}

interface TimeHistoryChartProps {
  timesS: ArrayLike<number>;
  series: readonly TimeHistorySeries[];
  /** The vertical axis title with its unit, e.g. "displacement [m]". */
  valueAxisLabel: string;
  description: string;
}

/** Time histories of several quantities over one time axis in seconds. */
export default function TimeHistoryChart({ timesS, series, valueAxisLabel, description }: TimeHistoryChartProps) {
  return (
    <ChartFigure description={description}>
      <Line
        role="img"
        aria-label={description}
        data={{
          datasets: series.map((entry, index) => ({
            label: entry.label,
            data: Array.from({ length: timesS.length }, (_, i) => ({ x: timesS[i], y: entry.values[i] })),
            ...seriesStyle(index),
            borderWidth: 1.75,
            pointRadius: 0,
            tension: 0,
          })),
        }}
        options={{
          ...plotBaseOptions,
          parsing: false,
          normalized: true,
          interaction: nearestAlongX,
          plugins: {
            legend: bottomLegend,
            tooltip: {
              callbacks: {
                title: (items) => (items[0] ? `t = ${formatTick(items[0].parsed.x ?? 0)} s` : ''),
                label: seriesValueLabel,
              },
            },
          },
          scales: {
            x: {
              type: 'linear',
              title: axisTitle('time [s]'),
              ticks: numberTicks,
            },
            y: { title: axisTitle(valueAxisLabel), ticks: numberTicks },
          },
        }}
      />
    </ChartFigure>
  );
}
