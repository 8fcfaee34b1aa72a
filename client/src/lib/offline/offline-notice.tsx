import { useQueryClient, type QueryKey } from '@tanstack/react-query';
import { Alert } from '../../components/ui/alert';
import { useOnline } from './online';

const timeOf = (ms: number) =>
  new Date(ms).toLocaleString(undefined, { weekday: 'short', hour: 'numeric', minute: '2-digit' });

/**
 * With no signal, says where the page's figures come from ("what this phone last saw, at …") and
 * what is still waiting on the device; nothing while online.
 */
export function OfflineNotice({ updatedAt, waiting = 0 }: { updatedAt: number; waiting?: number }) {
  const online = useOnline();
  if (online) return null;
  return (
    <Alert tone="warning" title="No signal — showing what this phone last saw">
      {updatedAt > 0 ? <p>As saved on this phone on {timeOf(updatedAt)}.</p> : null}
      {waiting > 0 ? (
        <p>
          {waiting} {waiting === 1 ? 'change waits' : 'changes wait'} on this phone and {waiting === 1 ? 'goes' : 'go'}{' '}
          to the office when the connection is back.
        </p>
      ) : (
        <p>Nothing is waiting to be sent.</p>
      )}
    </Alert>
  );
}

/** OfflineNotice for a page showing one query held on the device (users, e-mail, outbox): when it was saved. */
export function OfflineNoticeFor({ queryKey }: { queryKey: QueryKey }) {
  const updatedAt = useQueryClient().getQueryState(queryKey)?.dataUpdatedAt ?? 0;
  return <OfflineNotice updatedAt={updatedAt} />;
}
