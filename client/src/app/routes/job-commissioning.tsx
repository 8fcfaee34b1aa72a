import { useParams } from 'react-router-dom';
import { z } from 'zod';
import { CommissioningPage } from '../../features/commissioning/components/commissioning-page';
import { SignaturePadField } from '../../features/customer-proposal/signing/signature-pad-field';

const params = z.object({ jobId: z.uuid({ message: 'That is not a job address.' }) });

/**
 * /jobs/:jobId/commissioning — the installer's record (loader: app/job-commissioning-loader.ts). The
 * customer's acknowledgement is drawn in the signing piece's box, composed in here (features stay apart).
 */
export default function JobCommissioningRoute() {
  const { jobId } = params.parse(useParams());
  return (
    <CommissioningPage
      jobId={jobId}
      signatureBox={({ id, onChange }) => <SignaturePadField id={id} onChange={onChange} />}
    />
  );
}
