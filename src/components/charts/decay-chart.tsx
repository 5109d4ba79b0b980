import { Line } from 'react-chartjs-2';
import { formatTick, seriesStyle } from './chart-theme';

export interface DecayChartProps {
  envelope: { timesS: readonly number[]; values: readonly number[] };
  fit?: { timesS: readonly number[]; values: readonly number[] } | null;
  description: string;
}

const points = (x: readonly number[], y: readonly number[]) => x.map((value, i) => ({ x: value, y: y[i] }));

/** A free decay's envelope and the exponential fitted to it. */
export default function DecayChart({ envelope, fit, description }: DecayChartProps) {
  return (
    <figure className="flex flex-col gap-2">
      <div className="relative h-72 w-full">
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
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            parsing: false,
            interaction: { mode: 'nearest', axis: 'x', intersect: false },
            plugins: {
              legend: { position: 'bottom', labels: { boxWidth: 24 } },
              tooltip: { callbacks: { title: (items) => (items[0] ? `t = ${formatTick(items[0].parsed.x ?? 0)} s` : '') } },
            },
            scales: {
              x: { type: 'linear', title: { display: true, text: 'time [s]' }, ticks: { callback: (value) => formatTick(Number(value)) } },
              y: { type: 'linear', title: { display: true, text: 'envelope [m/s²]' }, ticks: { callback: (value) => formatTick(Number(value)) } },
            },
          }}
        />
      </div>
      <figcaption className="text-caption text-ink-muted">{description}</figcaption>
    </figure>
  );
}
