import { Alert } from '../../../components/ui/alert';
import type { FileNotice } from '../../../lib/offline/file-queue';
import { usePhotoQueue, usePhotoQueueState } from '../sync/photo-queue-context';

/**
 * Photos the server refused, in its words, until dismissed: the photo itself is gone from the
 * device by then, so this is the one place the person learns of it. `show` picks which ones.
 */
export function PhotoRefusals({ show }: { show: (notice: FileNotice) => boolean }) {
  const queue = usePhotoQueue();
  const refused = usePhotoQueueState().notices.filter((n) => n.kind === 'refused' && show(n));
  return refused.map((n) => (
    <Alert key={n.id} tone="danger" title={`${n.fileName} was not added.`}>
      <p>{n.message}</p>
      <button type="button" className="mt-1 font-semibold underline" onClick={() => queue.dismiss(n.id)}>
        Dismiss
      </button>
    </Alert>
  ));
}
