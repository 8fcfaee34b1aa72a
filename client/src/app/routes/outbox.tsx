import type { QueryClient } from '@tanstack/react-query';
import { useRouteError, type LoaderFunctionArgs } from 'react-router-dom';
import { RouteError } from '../../components/errors/route-error';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { outboxQueryOptions } from '../../features/outbox/api/get-outbox';
import { OutboxView } from '../../features/outbox/components/outbox-view';
import { isApiError } from '../../lib/api-error';
import { requireArea } from '../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'outbox');
    await queryClient.ensureQueryData(outboxQueryOptions());
    return null;
  };

const lead = 'E-mail this development server would have sent: invitations, proposals, receipts.';

export default function OutboxRoute() {
  return (
    <>
      <PageHeader title="Outbox" lead={lead} />
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
