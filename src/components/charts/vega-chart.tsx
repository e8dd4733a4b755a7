import { lazy, Suspense } from 'react';
import { LoadingState } from '../ui/loading-state.tsx';
import type { VegaChartProps } from './vega-chart-impl.tsx';

// Vega is about 1 MB: it loads with the first chart, not with the app.
const VegaChartImpl = lazy(() => import('./vega-chart-impl.tsx'));

/** A themed, CSP-safe Vega-Lite chart, loaded on first use. */
export function VegaChart(props: VegaChartProps) {
  return (
    <Suspense fallback={<LoadingState label="Loading chart…" />}>
      <VegaChartImpl {...props} />
    </Suspense>
  );
}

export type { VegaChartProps };
