import { Link } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { paths } from '../../config/paths';

export default function NotFoundRoute() {
  return (
    <section className="py-8">
      <h1 className="text-2xl font-semibold text-ink-900">Page not found</h1>
      <p className="mt-2 max-w-prose">
        There is no page at this address. It may have moved, or the link may be incomplete.
      </p>
      <Link to={paths.home} className={`${buttonClass('primary')} mt-6`}>
        Go to the start page
      </Link>
    </section>
  );
}
