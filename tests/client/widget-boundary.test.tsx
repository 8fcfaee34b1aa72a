import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { WidgetBoundary } from '../../client/src/components/errors/widget-boundary';
import { ApiError } from '../../client/src/lib/api-error';

let fail = true;
function Flaky() {
  if (fail)
    throw new ApiError({
      status: 503,
      code: 'unavailable',
      title: 'Service unavailable',
      detail: 'Try again shortly.',
    });
  return <p>Panel content</p>;
}

function Page() {
  return (
    <>
      <h1>Rest of the page</h1>
      <WidgetBoundary name="the panel">
        <Flaky />
      </WidgetBoundary>
    </>
  );
}

afterEach(() => vi.restoreAllMocks());

describe('WidgetBoundary', () => {
  it('contains a failure to its panel and recovers on retry', () => {
    vi.spyOn(console, 'error').mockImplementation(() => {});
    render(<Page />);
    expect(screen.getByRole('heading', { name: /Rest of the page/ })).toBeInTheDocument();
    expect(screen.getByRole('alert')).toHaveTextContent('Could not show the panel.Try again shortly.');
    fail = false;
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(screen.getByText('Panel content')).toBeInTheDocument();
  });
});
