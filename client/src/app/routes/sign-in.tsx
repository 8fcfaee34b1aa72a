import type { QueryClient } from '@tanstack/react-query';
import { redirect, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { z } from 'zod';
import { Wordmark } from '../../components/layout/wordmark';
import { safeNext } from '../../config/paths';
import { meQueryOptions } from '../../features/auth/api/get-me';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { searchParamsObject } from '../../lib/route-params';

const searchSchema = z.object({ next: z.string().optional() }).catch({});

function nextFrom(search: URLSearchParams): string {
  return safeNext(searchSchema.parse(searchParamsObject(search)).next);
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Already signed in: no reason to show the form. Always ask the server here — a cached
    // user may belong to a session that has just expired.
    const me = await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 });
    if (me) throw redirect(nextFrom(new URL(request.url).searchParams));
    return null;
  };

export default function SignInRoute() {
  const [search] = useSearchParams();
  const navigate = useNavigate();
  return (
    <main className="flex min-h-dvh flex-col items-center bg-ink-900 px-4 py-10 sm:justify-center">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex justify-center">
          <Wordmark inverse />
        </div>
        <div className="rounded-lg bg-white p-6 shadow-card">
          <h1 className="mb-1 text-xl font-bold text-ink-900">Sign in</h1>
          <p className="mb-5 text-base text-muted">Use the e-mail and password your company owner set up for you.</p>
          <SignInForm onSignedIn={() => navigate(nextFrom(search), { replace: true })} />
        </div>
      </div>
    </main>
  );
}
