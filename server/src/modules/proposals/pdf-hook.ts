import type { Services } from '../../services/services';
import type { OnIssued } from './proposal.service';

/**
 * THE HOOK FOR THE PDF SLICE (pdf14): what issuing does, inside its transaction, once a version is stored —
 * add the PDF render task for it (`services.queue.add('render-proposal-pdf', { versionId }, { em: tx })`,
 * so the task exists exactly when the version does). Until that task kind is in tasks/kinds.ts, issuing
 * adds nothing and the version stays `pdf_state = 'waiting'`.
 */
export function renderPdfAfterIssue(_services: Services): OnIssued | undefined {
  return undefined;
}
