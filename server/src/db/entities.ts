import { CompanySchema } from '../modules/companies/company.entity';
import { UserSchema } from '../modules/users/user.entity';
import { CompanySettingsSchema } from '../modules/company-settings/company-settings.entity';
import { CompanyLogoSchema, CompanyProposalDetailsSchema } from '../modules/company-settings/proposal-details.entity';
import { CustomerSchema } from '../modules/customers/customer.entity';
import { JobSchema } from '../modules/jobs/job.entity';
import { PhotoSchema } from '../modules/photos/photo.entity';
import { OutgoingMessageSchema } from '../modules/mail/outgoing-message.entity';
import { PasswordResetTokenSchema } from '../modules/auth/password-reset-token.entity';
import { RoomSchema } from '../modules/rooms/room.entity';
import { DesignOptionSchema } from '../modules/desk/option.entity';
import { ProposalEventSchema, ProposalSchema, ProposalVersionSchema } from '../modules/proposals/proposal.entity';
import { CompanyLossReasonsSchema } from '../modules/jobs/loss-reasons.entity';
import { PaymentSchema } from '../modules/payments/payment.entity';
import { JobAssignmentSchema } from '../modules/install/assignment.entity';
import { ProposalLinkSchema } from '../modules/proposal-links/proposal-link.entity';
import {
  CompanyDataChangeSchema,
  CompanyDataRowSchema,
  PriceBookSettingsSchema,
} from '../modules/company-data/company-data.entity';

/** Every entity the ORM knows. A module adds its schema here. */
export const entities = [
  CompanySchema,
  UserSchema,
  CompanySettingsSchema,
  CompanyProposalDetailsSchema,
  CompanyLogoSchema,
  CustomerSchema,
  JobSchema,
  RoomSchema,
  PhotoSchema,
  OutgoingMessageSchema,
  CompanyDataRowSchema,
  CompanyDataChangeSchema,
  PriceBookSettingsSchema,
  PasswordResetTokenSchema,
  DesignOptionSchema,
  ProposalSchema,
  ProposalVersionSchema,
  ProposalEventSchema,
  PaymentSchema,
  CompanyLossReasonsSchema,
  ProposalLinkSchema,
  JobAssignmentSchema,
];
