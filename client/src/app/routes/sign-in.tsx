import type { QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PublicPage } from '../../components/layout/public-page';
import { paths, safeNext } from '../../config/paths';
import { authKeys } from '../../features/auth/query-keys';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { apiFetch } from '../../lib/api-client';

/**
 * The sign-in page is the first page a phone opens, so it loads no zod (issue 11: ≤ 120 KB of
 * JavaScript): the loader needs only to know whether someone is signed in, and the page it sends
 * them to reads and checks who (the signed-in guard parses /api/auth/session with the contract).
 */
const nextFrom = (search: URLSearchParams): string => safeNext(search.get('next'));

function someoneSignedIn(body: unknown): boolean {
  const me: unknown = typeof body === 'object' && body !== null ? Reflect.get(body, 'me') : null;
  return typeof me === 'object' && me !== null;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Already signed in: no reason to show the form. Always ask the server here — a cached
    // user may belong to a session that has just expired.
    if (someoneSignedIn(await apiFetch('/api/auth/session')))
      throw redirect(nextFrom(new URL(request.url).searchParams));
    // Nobody is: a user kept from before (an ended session) must not let the guard wave them in.
    queryClient.setQueryData(authKeys.me(), null);
    return null;
  };

export default function SignInRoute() {
  const [search] = useSearchParams();
  const navigate = useNavigate();
  return (
    <PublicPage title="Sign in" lead="Use the e-mail and password your company owner set up for you.">
      <SignInForm onSignedIn={() => navigate(nextFrom(search), { replace: true })} />
      <p className="mt-4 text-base">
        <Link to={paths.forgotPassword} className="font-semibold text-ink-800 underline underline-offset-2">
          Forgot your password?
        </Link>
      </p>
    </PublicPage>
  );
}
