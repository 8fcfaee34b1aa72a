import { usePhotoQueueState } from '../sync/photo-queue-context';
import { useQueueState } from '../sync/queue-context';
import { useTypingCount } from '../sync/pending-typing';
import { SaveStatusPill, saveStatus } from './save-status-pill';

export function LiveSaveStatus() {
  const state = useQueueState();
  const typing = useTypingCount();
  const photos = usePhotoQueueState().waiting.length;
  return <SaveStatusPill status={saveStatus(state, typing, photos)} />;
}
