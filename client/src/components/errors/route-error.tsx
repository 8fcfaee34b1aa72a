import { isRouteErrorResponse, Link, useLocation, useRouteError } from 'react-router-dom';
import { paths, signInPath } from '../../config/paths';
import { isApiError } from '../../lib/api-error';
import { NOTHING_HELD } from '../../lib/offline/online';
import { buttonClass } from '../ui/button';

function describe(error: unknown): { title: string; detail: string; signIn: boolean } {
  if (isApiError(error)) {
    if (error.code === 'network') return { title: 'No signal', detail: NOTHING_HELD, signIn: false };
    if (error.status === 401)
      return { title: 'Your session has ended', detail: 'Sign in again to carry on where you were.', signIn: true };
    if (error.status === 403) return { title: 'Not available to your role', detail: error.detail, signIn: false };
    if (error.status === 404)
      return {
        title: 'Not found',
        detail: 'This record does not exist, or it belongs to another company.',
        signIn: false,
      };
    return { title: error.title, detail: error.detail, signIn: false };
  }
  if (isRouteErrorResponse(error) && error.status === 404) {
    return { title: 'Page not found', detail: 'There is no page at this address.', signIn: false };
  }
  return {
    title: 'This page stopped working',
    detail: 'Something went wrong while showing it. Reload to try again; what you saved is safe.',
    signIn: false,
  };
}

/** errorElement for every route: says what happened and offers the way back. */
export function RouteError() {
  const error = useRouteError();
  const location = useLocation();
  const { title, detail, signIn } = describe(error);
  if (!isApiError(error) && !isRouteErrorResponse(error)) console.error(error);
  return (
    <div role="alert" className="mx-auto max-w-xl px-4 py-12">
      <h1 className="text-2xl font-semibold text-ink-900">{title}</h1>
      <p className="mt-2 text-base text-ink-950">{detail}</p>
      <div className="mt-6 flex flex-wrap gap-3">
        {signIn ? (
          <Link className={buttonClass('primary')} to={signInPath(location.pathname + location.search)}>
            Sign in
          </Link>
        ) : (
          <Link className={buttonClass('primary')} to={paths.home}>
            Go to the start page
          </Link>
        )}
        <button type="button" className={buttonClass('secondary')} onClick={() => window.location.reload()}>
          Reload
        </button>
      </div>
    </div>
  );
}
