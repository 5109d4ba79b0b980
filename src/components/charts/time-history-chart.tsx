import { Line } from 'react-chartjs-2';
import { formatTick, seriesStyle } from './chart-theme';

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
    <figure className="flex flex-col gap-2">
      <div className="relative h-72 w-full">
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
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            parsing: false,
            normalized: true,
            interaction: { mode: 'nearest', axis: 'x', intersect: false },
            plugins: {
              legend: { position: 'bottom', labels: { boxWidth: 24 } },
              tooltip: {
                callbacks: {
                  title: (items) => (items[0] ? `t = ${formatTick(items[0].parsed.x ?? 0)} s` : ''),
                  label: (item) => `${item.dataset.label}: ${formatTick(item.parsed.y ?? 0)}`,
                },
              },
            },
            scales: {
              x: {
                type: 'linear',
                title: { display: true, text: 'time [s]' },
                ticks: { callback: (value) => formatTick(Number(value)) },
              },
              y: { title: { display: true, text: valueAxisLabel }, ticks: { callback: (value) => formatTick(Number(value)) } },
            },
          }}
        />
      </div>
      <figcaption className="text-caption text-ink-muted">{description}</figcaption>
    </figure>
  );
}
