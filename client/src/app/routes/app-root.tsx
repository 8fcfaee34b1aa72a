import type { QueryClient } from '@tanstack/react-query';
import { Suspense, useMemo, useState } from 'react';
import { Outlet, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { OWNER_ROLES, roleIn } from '@contract';
import { AppShell } from '../../components/layout/app-shell';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { Spinner } from '../../components/ui/spinner';
import type { Feature } from '../../config/nav';
import { useSignedIn } from '../../features/auth/api/get-me';
import { useSignOut } from '../../features/auth/api/sign-out';
import { useOutboxAvailable } from '../../features/outbox/api/get-outbox';
import { NOTICE_NOT_ALLOWED, requireUser } from '../guards';
import { usePhotoQueueState } from '../../features/walkthrough/sync/photo-queue-context';
import { useQueueState } from '../../features/walkthrough/sync/queue-context';
import { SignOutQuestion } from '../../lib/offline/sign-out-question';
import { CompanyContext } from '../../lib/company';
import { ViewerContext } from '../../lib/viewer';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

function RoleNotice() {
  const [params, setParams] = useSearchParams();
  if (params.get('notice') !== NOTICE_NOT_ALLOWED) return null;
  const handleDismiss = () => {
    params.delete('notice');
    setParams(params, { replace: true });
  };
  return (
    <div className="mb-6 flex flex-col gap-2">
      <Alert tone="warning" title="That page is not part of your role">
        You were brought back to your start page. If you need it, ask an owner of your company to change your role.
      </Alert>
      <Button variant="ghost" className="self-start" onClick={handleDismiss}>
        Dismiss
      </Button>
    </div>
  );
}

export default function AppRoot() {
  const { user, company } = useSignedIn();
  const signOut = useSignOut();
  const outbox = useOutboxAvailable(roleIn(OWNER_ROLES, user.role));
  const viewer = useMemo(() => ({ id: user.id, role: user.role }), [user.id, user.role]);
  const companyIdentity = useMemo(() => ({ id: company.id, name: company.name }), [company.id, company.name]);
  const features = useMemo<ReadonlySet<Feature>>(() => new Set(outbox ? ['outbox'] : []), [outbox]);
  // Using the queues here also starts them: what this person left waiting is sent once they are back.
  const waiting = useQueueState().items.length + usePhotoQueueState().waiting.length;
  const [asking, setAsking] = useState(false);

  return (
    <AppShell
      user={user}
      companyName={company.name}
      features={features}
      signingOut={signOut.isPending}
      onSignOut={() => (waiting > 0 ? setAsking(true) : signOut.mutate())}
    >
      {asking ? (
        <SignOutQuestion
          count={waiting}
          busy={signOut.isPending}
          onStay={() => setAsking(false)}
          onSignOut={() => signOut.mutate()}
        />
      ) : null}
      <RoleNotice />
      <ViewerContext.Provider value={viewer}>
        <CompanyContext.Provider value={companyIdentity}>
          <Suspense fallback={<Spinner />}>
            <Outlet />
          </Suspense>
        </CompanyContext.Provider>
      </ViewerContext.Provider>
    </AppShell>
  );
}
