import { lazy, Suspense } from 'react';
import type { LogCharts } from '../../shared/schemas/logbook-read';
import { LoadingState } from '../ui/states';

// The chart library is about 370 KB: a chunk of its own, fetched when a page with charts opens.
const Panel = lazy(() => import('./log-charts').then((m) => ({ default: m.LogChartsPanel })));

/** The period's charts (log-charts.tsx), loaded on demand. */
export function LazyLogChartsPanel({ data }: { data: LogCharts }) {
  return (
    <Suspense fallback={<LoadingState label="Loading the charts…" />}>
      <Panel data={data} />
    </Suspense>
  );
}
