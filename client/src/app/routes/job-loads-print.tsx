import { LoadPrintPage } from '../../features/loads/components/load-print-page';

/** /jobs/:jobId/loads/print — the customer's printable copy. */
export default function JobLoadsPrintRoute() {
  return <LoadPrintPage />;
}
