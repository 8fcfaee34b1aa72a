import { useQueueState } from '../sync/queue-context';
import { useTypingCount } from '../sync/pending-typing';
import { SaveStatusPill, saveStatus } from './save-status-pill';

export function LiveSaveStatus() {
  const state = useQueueState();
  const typing = useTypingCount();
  return <SaveStatusPill status={saveStatus(state, typing)} />;
}
