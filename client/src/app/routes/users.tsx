import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { QueryWidgetBoundary } from '../../components/errors/query-widget-boundary';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { useSignedIn } from '../../features/auth/api/get-me';
import { usersQueryOptions } from '../../features/users/api/get-users';
import { CreateUserForm } from '../../features/users/components/create-user-form';
import { UsersTable } from '../../features/users/components/users-table';
import { requireArea } from '../guards';
import { ensureHeld } from '../../lib/offline/online';
import { OfflineNoticeFor } from '../../lib/offline/offline-notice';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'users');
    // With no signal and nothing held on the device: "No signal" in words at once, not a wait with no end.
    const options = usersQueryOptions();
    await ensureHeld(queryClient, options.queryKey, () => queryClient.ensureQueryData(options));
    return null;
  };

export default function UsersRoute() {
  const { user, company } = useSignedIn();
  return (
    <>
      <PageHeader
        title="Users"
        lead={`Everyone who can sign in to ${company.name}, and what their role lets them do.`}
      />
      <div className="flex flex-col gap-6">
        <OfflineNoticeFor queryKey={usersQueryOptions().queryKey} />
        <Card title="People">
          <QueryWidgetBoundary name="the list of users">
            <UsersTable currentUserId={user.id} />
          </QueryWidgetBoundary>
        </Card>
        <Card title="Add a user">
          <CreateUserForm />
        </Card>
      </div>
    </>
  );
}
