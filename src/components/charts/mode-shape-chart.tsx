import { Line } from 'react-chartjs-2';
import { formatTick, seriesStyle } from './chart-theme';

export interface ModeShapeSeries {
  label: string;
  /** One value per degree of freedom, scaled so that the largest magnitude is 1. */
  shape: readonly number[];
}

interface ModeShapeChartProps {
  /** Names of the degrees of freedom along the horizontal axis. */
  dofLabels: readonly string[];
  modes: readonly ModeShapeSeries[];
  /** Says in words what the plot shows, for people who do not see it. */
  description: string;
  /** A chain's shapes start from the ground, drawn as a first point at 0. */
  fromGround?: boolean;
}

/** Mode shapes plotted over the degrees of freedom, each scaled to 1 at its largest entry. */
export default function ModeShapeChart({ dofLabels, modes, description, fromGround = false }: ModeShapeChartProps) {
  return (
    <figure className="flex flex-col gap-2">
      <div className="relative h-72 w-full">
        <Line
          role="img"
          aria-label={description}
          data={{
            labels: fromGround ? ['ground', ...dofLabels] : [...dofLabels],
            datasets: modes.map((mode, index) => ({
              label: mode.label,
              data: fromGround ? [0, ...mode.shape] : [...mode.shape],
              ...seriesStyle(index),
              borderWidth: 2,
              pointRadius: 4,
              tension: 0,
            })),
          }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            interaction: { mode: 'index', intersect: false },
            plugins: {
              legend: { position: 'bottom', labels: { boxWidth: 24 } },
              tooltip: { callbacks: { label: (item) => `${item.dataset.label}: ${formatTick(item.parsed.y ?? 0)}` } },
            },
            scales: {
              x: { title: { display: true, text: 'degree of freedom' } },
              y: {
                min: -1.1,
                max: 1.1,
                title: { display: true, text: 'mode shape [–]' },
                ticks: { callback: (value) => formatTick(Number(value)) },
              },
            },
          }}
        />
      </div>
      <figcaption className="text-caption text-ink-muted">{description}</figcaption>
    </figure>
  );
}
