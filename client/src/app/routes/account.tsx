import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { useSignedIn } from '../../features/auth/api/get-me';
import { ChangePasswordForm } from '../../features/auth/components/change-password-form';
import { requireArea } from '../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireArea(queryClient, request, 'account');
    return null;
  };

export default function AccountRoute() {
  const { user } = useSignedIn();
  return (
    <>
      <PageHeader title="Your account" lead={`Signed in as ${user.email}.`} />
      <Card title="Change your password">
        <p className="mb-4 max-w-prose text-base text-muted">
          Changing it signs you out on every other phone, tablet or computer. This one stays signed in.
        </p>
        <ChangePasswordForm />
      </Card>
    </>
  );
}
