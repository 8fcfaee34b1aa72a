import type { Services } from '../../services/services';
import type { OnIssued } from './proposal.service';
import { queuePdfRender } from './proposal-pdf.service';

/**
 * What issuing does, inside its transaction, once a version is stored: add the PDF render task for it, so the
 * task exists exactly when the version does (a rolled-back issue leaves neither).
 */
export function renderPdfAfterIssue(services: Services): OnIssued {
  return (tx, version) => queuePdfRender(services.queue, version.id, tx);
}
