import { Migration } from '@mikro-orm/migrations';

/**
 * The proposal audit trail also records the version's PDF: 'pdf-ready' when it is rendered and its
 * SHA-256 recorded, 'pdf-failed' after the queue's last try (contract PROPOSAL_EVENT_KINDS).
 */
const BEFORE = [
  'issued',
  'superseded',
  'sent',
  'send-failed',
  'opened',
  'viewed',
  'downloaded',
  'option-chosen',
  'consented',
  'signed',
  'paid',
  'refunded',
  'cancelled',
  'link-revoked',
  'marked-lost',
];
const AFTER = [...BEFORE, 'pdf-ready', 'pdf-failed'];

const check = (kinds: readonly string[]) =>
  `alter table "proposal_event" add constraint "proposal_event_kind_check" check ("kind" in (${kinds.map((k) => `'${k}'`).join(', ')}));`;

export class Migration20261208080000_proposal_pdf_events extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "proposal_event" drop constraint "proposal_event_kind_check";`);
    this.addSql(check(AFTER));
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "proposal_event" drop constraint "proposal_event_kind_check";`);
    this.addSql(check(BEFORE));
  }
}
