import { isApiError } from '../../../lib/api-error';
import { Button } from '../../../components/ui/button';

/** Reasons the server gives (409) that a reload of the page resolves: a new version, a changed text or choice. */
const RELOAD = new Set(['superseded', 'disclosure-changed', 'statement-changed', 'option-changed', 'signed']);

/** Under an error: a "Reload the page" button when reloading is the way on. */
export function ReloadHint({ error }: { error: unknown }) {
  if (!isApiError(error) || error.status !== 409) return null;
  const reason = error.extra.reason;
  if (typeof reason !== 'string' || !RELOAD.has(reason)) return null;
  return (
    <div className="mt-2">
      <Button variant="secondary" onClick={() => window.location.reload()}>
        Reload the page
      </Button>
    </div>
  );
}
