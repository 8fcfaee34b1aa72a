import { QueryErrorResetBoundary } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { WidgetBoundary } from './widget-boundary';

/** WidgetBoundary that also lets failed queries inside it fetch again on "Try again". */
export function QueryWidgetBoundary({ name, children }: { name: string; children: ReactNode }) {
  return (
    <QueryErrorResetBoundary>
      {({ reset }) => (
        <WidgetBoundary name={name} onReset={reset}>
          {children}
        </WidgetBoundary>
      )}
    </QueryErrorResetBoundary>
  );
}
