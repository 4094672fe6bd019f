import { lazy, Suspense } from 'react';
import { LoadingState } from '../ui/states';
import type { ChartProps } from './chart';

const Chart = lazy(() => import('./chart'));

/** A chart whose ECharts code is fetched when the chart first renders. */
export function LazyChart(props: ChartProps) {
  return (
    <Suspense fallback={<LoadingState label="Drawing the chart…" />}>
      <Chart {...props} />
    </Suspense>
  );
}
