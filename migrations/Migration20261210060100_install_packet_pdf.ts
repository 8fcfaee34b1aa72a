import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 15 (pack15): the job packet's PDF, one per job, made by the queue (`render-install-packet`). Asking
 * again replaces it (the rooms' notes may have changed since), so `request_seq` counts the asks and a try
 * records its bytes only while it is still the latest ask. No price is in it: the packet reads the signed
 * option's equipment, lines, charge, electrical, condensate and material list only.
 */
export class Migration20261210060100_install_packet_pdf extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "install_packet_pdf" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "job_id" uuid not null references "job" ("id") on update cascade on delete cascade,
      "version_id" uuid not null references "proposal_version" ("id") on update cascade on delete cascade,
      "state" varchar(10) not null check ("state" in ('waiting', 'rendering', 'ready', 'failed')),
      "request_seq" integer not null default 1 check ("request_seq" > 0),
      "sha256" char(64) null check ("sha256" is null or "sha256" ~ '^[0-9a-f]{64}$'),
      "storage_key" varchar(300) null,
      "failure" varchar(300) null,
      "requested_at" timestamptz not null,
      "made_at" timestamptz null,
      constraint "install_packet_pdf_job_unique" unique ("job_id"),
      constraint "install_packet_pdf_ready" check (("state" = 'ready') = ("sha256" is not null and "storage_key" is not null))
    );`);
    this.addSql(`create index "install_packet_pdf_company_index" on "install_packet_pdf" ("company_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "install_packet_pdf";`);
  }
}
