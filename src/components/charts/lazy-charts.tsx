/**
 * The plots load on demand (Chart.js is the client's largest library), each behind a quiet placeholder, so the pages
 * without plots stay light.
 */
import { lazy, Suspense, type ComponentProps } from 'react';
import { Loading } from '../ui/loading';

const ModeShapeChartLazy = lazy(() => import('./mode-shape-chart'));
const TimeHistoryChartLazy = lazy(() => import('./time-history-chart'));
const FrequencyResponseChartLazy = lazy(() => import('./frequency-response-chart'));
const HeatMapChartLazy = lazy(() => import('./heat-map-chart'));
const SpectrumChartLazy = lazy(() => import('./spectrum-chart'));
const DecayChartLazy = lazy(() => import('./decay-chart'));

export function ModeShapeChart(props: ComponentProps<typeof ModeShapeChartLazy>) {
  return (
    <Suspense fallback={<Loading label="Loading the plot…" />}>
      <ModeShapeChartLazy {...props} />
    </Suspense>
  );
}

export function TimeHistoryChart(props: ComponentProps<typeof TimeHistoryChartLazy>) {
  return (
    <Suspense fallback={<Loading label="Loading the plot…" />}>
      <TimeHistoryChartLazy {...props} />
    </Suspense>
  );
}

export function FrequencyResponseChart(props: ComponentProps<typeof FrequencyResponseChartLazy>) {
  return (
    <Suspense fallback={<Loading label="Loading the plot…" />}>
      <FrequencyResponseChartLazy {...props} />
    </Suspense>
  );
}

export function SpectrumChart(props: ComponentProps<typeof SpectrumChartLazy>) {
  return (
    <Suspense fallback={<Loading label="Loading the plot…" />}>
      <SpectrumChartLazy {...props} />
    </Suspense>
  );
}

export function HeatMapChart(props: ComponentProps<typeof HeatMapChartLazy>) {
  return (
    <Suspense fallback={<Loading label="Loading the map…" />}>
      <HeatMapChartLazy {...props} />
    </Suspense>
  );
}

export function DecayChart(props: ComponentProps<typeof DecayChartLazy>) {
  return (
    <Suspense fallback={<Loading label="Loading the plot…" />}>
      <DecayChartLazy {...props} />
    </Suspense>
  );
}
