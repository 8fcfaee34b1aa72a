import type { QueryClient } from '@tanstack/react-query';
import { useRouteError, type LoaderFunctionArgs } from 'react-router-dom';
import { RouteError } from '../../components/errors/route-error';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { outboxQueryOptions } from '../../features/outbox/api/get-outbox';
import { OutboxView } from '../../features/outbox/components/outbox-view';
import { isApiError } from '../../lib/api-error';
import { requireArea } from '../guards';
import { ensureHeld } from '../../lib/offline/online';
import { OfflineNoticeFor } from '../../lib/offline/offline-notice';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'outbox');
    // With no signal and nothing held on the device: "No signal" in words at once, not a wait with no end.
    const options = outboxQueryOptions();
    await ensureHeld(queryClient, options.queryKey, () => queryClient.ensureQueryData(options));
    return null;
  };

const lead = 'E-mail this development server would have sent: invitations, proposals, receipts.';

export default function OutboxRoute() {
  return (
    <>
      <PageHeader title="Outbox" lead={lead} />
      <OfflineNoticeFor queryKey={outboxQueryOptions().queryKey} />
      <OutboxView />
    </>
  );
}

/** The server answers 404 when the outbox is switched off (production): say so plainly. */
export function ErrorBoundary() {
  const error = useRouteError();
  if (!isApiError(error) || error.status !== 404) return <RouteError />;
  return (
    <>
      <PageHeader title="Outbox" lead={lead} />
      <EmptyState title="The outbox is off on this server">
        It exists only on development and test servers. Here, e-mail goes out to the real recipients.
      </EmptyState>
    </>
  );
}
