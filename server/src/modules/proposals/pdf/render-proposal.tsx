import { renderToBuffer } from '@react-pdf/renderer';
import { loadProposalFonts } from './fonts';
import { ProposalDocument, type ProposalDocumentProps } from './proposal-document';

/** The proposal's PDF bytes. The first call in a process also loads the typeface (a few hundred ms). */
export async function renderProposalPdf(props: ProposalDocumentProps): Promise<Buffer> {
  await loadProposalFonts();
  return renderToBuffer(<ProposalDocument {...props} />);
}
