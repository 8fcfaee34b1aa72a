import { lazy, Suspense, type ComponentProps } from 'react';
import { useAfterIdle } from '../../../lib/use-after-idle';
import { useNearView } from '../../../lib/use-near-view';

// The chart library is the biggest thing the loads screens use: it loads only where a chart is drawn,
// after the page can already be typed into (issue 11's first-load budgets).
const ComponentChart = lazy(async () => ({ default: (await import('./component-chart')).ComponentChart }));

// The words are text, not aria-label: a div with no role may not carry a name (axe: aria-prohibited-attr).
const placeholder = (
  <div className="h-[300px] w-full" aria-busy="true">
    <span className="sr-only">Loading the chart</span>
  </div>
);

/**
 * ComponentChart, loaded on first use once the page has had an idle moment (its first render is the
 * heaviest work on the walk-through) and the chart's place is on or near the screen (on a phone the
 * room's panel is below the form: the chart waits until someone scrolls towards it); the same height
 * while it waits, so nothing below jumps.
 */
export function LazyComponentChart(props: ComponentProps<typeof ComponentChart>) {
  const idle = useAfterIdle();
  const [ref, near] = useNearView<HTMLDivElement>();
  if (!idle || !near)
    return (
      <div ref={ref} className="h-[300px] w-full" aria-busy="true">
        <span className="sr-only">Loading the chart</span>
      </div>
    );
  return (
    <Suspense fallback={placeholder}>
      <ComponentChart {...props} />
    </Suspense>
  );
}
