import { usePhotoQueueState } from '../sync/photo-queue-context';
import { useQueueState } from '../sync/queue-context';
import { useTypingCount } from '../../../lib/offline/typing';
import { useUnsavedFieldCount } from '../../../lib/offline/unsaved-fields';
import { SaveStatusPill, saveStatus } from '../../../lib/offline/save-status-pill';

export function LiveSaveStatus() {
  const state = useQueueState();
  const typing = useTypingCount();
  const photos = usePhotoQueueState().waiting.length;
  const invalid = useUnsavedFieldCount();
  return <SaveStatusPill status={saveStatus(state, typing, photos, invalid)} />;
}
