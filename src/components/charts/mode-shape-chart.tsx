import { Line } from 'react-chartjs-2';
import { ChartFigure } from './chart-figure';
import { axisTitle, bottomLegend, numberTicks, plotBaseOptions, seriesStyle, seriesValueLabel } from './chart-theme';

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
    <ChartFigure description={description}>
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
          ...plotBaseOptions,
          interaction: { mode: 'index', intersect: false },
          plugins: {
            legend: bottomLegend,
            tooltip: { callbacks: { label: seriesValueLabel } },
          },
          scales: {
            x: { title: axisTitle('degree of freedom') },
            y: {
              min: -1.1,
              max: 1.1,
              title: axisTitle('mode shape [–]'),
              ticks: numberTicks,
            },
          },
        }}
      />
    </ChartFigure>
  );
}
