import type { QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { z } from 'zod';
import { PublicPage } from '../../components/layout/public-page';
import { paths, safeNext } from '../../config/paths';
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
