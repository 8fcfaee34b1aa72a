import type { ProposalDetailsRecord } from '@contract';
import type { CompanyLogo, CompanyProposalDetails } from './proposal-details.entity';

/** Where the office's screens read the logo; a new upload is a new row, so a new address. */
export const logoUrl = (logoId: string): string => `/api/company/logo/${logoId}`;

export function presentProposalDetails(
  row: CompanyProposalDetails | null,
  logo: CompanyLogo | null,
): ProposalDetailsRecord {
  return {
    address: row?.address ?? '',
    phone: row?.phone ?? '',
    email: row?.email ?? '',
    licence: row?.licence ?? '',
    terms: row?.terms ?? '',
    warranty: row?.warranty ?? '',
    cancellationExtra: row?.cancellationExtra ?? '',
    logo: logo
      ? {
          width: logo.width,
          height: logo.height,
          bytes: logo.byteSize,
          uploadedAt: logo.uploadedAt.toISOString(),
          url: logoUrl(logo.id),
        }
      : null,
    version: row?.version ?? 0,
    updatedAt: row ? row.updatedAt.toISOString() : null,
  };
}
