import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { paths } from '../../../config/paths';
import { messagesQueryOptions } from '../api/get-messages';

/**
 * For the owner's start page: says when e-mail has not gone out (a new account's notice, a reset link),
 * so a mail outage is seen without opening the E-mail page. Shows nothing otherwise, or while loading.
 */
export function MailTrouble() {
  const { data } = useQuery(messagesQueryOptions());
  const stuck = (data ?? []).filter((m) => m.state === 'retrying' || m.state === 'failed').length;
  if (stuck === 0) return null;
  return (
    <div className="mb-6">
      <Alert tone="warning" title={`${stuck} ${stuck === 1 ? 'e-mail has' : 'e-mails have'} not gone out`}>
        The mail server has not accepted {stuck === 1 ? 'it' : 'them'} yet.{' '}
        <Link to={paths.mail} className="font-semibold underline underline-offset-2">
          See E-mail
        </Link>
      </Alert>
    </div>
  );
}
