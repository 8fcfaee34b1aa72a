import type { QueryClient } from '@tanstack/react-query';
import { useParams, useRouteError, type LoaderFunctionArgs } from 'react-router-dom';
import { z } from 'zod';
import { LINK_ENDED } from '@contract';
import { RouteError } from '../../components/errors/route-error';
import { customerProposalQueryOptions } from '../../features/customer-proposal/api/get-customer-proposal';
import { CustomerProposalPage } from '../../features/customer-proposal/components/customer-proposal-page';
import { endedFrom, LinkEnded } from '../../features/customer-proposal/components/link-ended';
import { isApiError } from '../../lib/api-error';
import { parseParams } from '../../lib/route-params';

/**
 * The customer's page, `/p/:proposalId` (where a proposal e-mail's link lands after the server's exchange).
 * No staff sign-in: the browser's proposal-link session is what the API checks, so this route sits outside
 * the signed-in shell and its guard.
 */
const params = z.object({ proposalId: z.uuid() });

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params: raw }: LoaderFunctionArgs) => {
    const { proposalId } = parseParams(params, raw);
    await queryClient.ensureQueryData(customerProposalQueryOptions(proposalId));
    return null;
  };

export default function CustomerProposalRoute() {
  const { proposalId } = parseParams(params, useParams());
  return <CustomerProposalPage proposalId={proposalId} />;
}

/** A link that ended (410), a session that ran out (401) or a proposal this browser may not see (404): said plainly. */
export function ErrorBoundary() {
  const error = useRouteError();
  if (isApiError(error) && error.status === 410) {
    const { contact } = endedFrom(error.extra);
    return <LinkEnded detail={error.detail} contact={contact} />;
  }
  if (isApiError(error) && error.status === 401) return <LinkEnded detail={LINK_ENDED.sessionEnded} contact={null} />;
  if ((isApiError(error) && error.status === 404) || (error instanceof Response && error.status === 404))
    return <LinkEnded detail={LINK_ENDED.unknown} contact={null} />;
  return <RouteError />;
}
