import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { QueryWidgetBoundary } from '../../components/errors/query-widget-boundary';
import { PageHeader } from '../../components/ui/page-header';
import { messagesQueryOptions } from '../../features/mail/api/get-messages';
import { MailList } from '../../features/mail/components/mail-list';
import { requireArea } from '../guards';
import { ensureHeld } from '../../lib/offline/online';
import { OfflineNoticeFor } from '../../lib/offline/offline-notice';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'mail');
    // With no signal and nothing held on the device: "No signal" in words at once, not a wait with no end.
    const options = messagesQueryOptions();
    await ensureHeld(queryClient, options.queryKey, () => queryClient.ensureQueryData(options));
    return null;
  };

export default function MailRoute() {
  return (
    <>
      <PageHeader
        title="E-mail"
        lead="What Gaugeline sent for your company, and anything the mail server has not accepted yet."
      />
      <OfflineNoticeFor queryKey={messagesQueryOptions().queryKey} />
      <QueryWidgetBoundary name="the e-mail list">
        <MailList />
      </QueryWidgetBoundary>
    </>
  );
}
