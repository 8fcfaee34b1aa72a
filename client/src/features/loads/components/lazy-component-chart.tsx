import { lazy, Suspense, type ComponentProps } from 'react';

// The chart library is the biggest thing the loads screens use: it loads only where a chart is drawn,
// after the page can already be typed into (issue 11's first-load budgets).
const ComponentChart = lazy(async () => ({ default: (await import('./component-chart')).ComponentChart }));

/** ComponentChart, loaded on first use; the same height while it loads, so nothing below jumps. */
export function LazyComponentChart(props: ComponentProps<typeof ComponentChart>) {
  return (
    <Suspense fallback={<div className="h-[300px] w-full" aria-busy="true" aria-label="Loading the chart" />}>
      <ComponentChart {...props} />
    </Suspense>
  );
}
