import { renderToBuffer } from '@react-pdf/renderer';
import type { InstallPacket } from '@contract';
import { loadProposalFonts } from '../../proposals/pdf/fonts';
import { PacketDocument } from './packet-document';

/** The packet's PDF bytes (the proposal's typeface, loaded once per process). */
export async function renderPacketPdf(packet: InstallPacket): Promise<Buffer> {
  await loadProposalFonts();
  return renderToBuffer(<PacketDocument packet={packet} />);
}
