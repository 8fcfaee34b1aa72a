import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 14 (office14): why a job was lost, and the company's list of reasons.
 *
 * `job.lost_reason` holds the words chosen when the job was marked lost (by hand from the company's list, or
 * the system's fixed "Cancelled by buyer"); a job that is not lost holds none. Jobs marked lost before this
 * column existed keep a null reason.
 *
 * `company_loss_reasons` is the owner's list (one row per company, made on the first save; until then the
 * contract's DEFAULT_LOSS_REASONS apply). It is its own row, apart from company_settings, so the list and the
 * settings document are saved (and version-locked) independently.
 */
export class Migration20261209010000_job_lost_reason extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "job" add column "lost_reason" varchar(80) null,
      add constraint "job_lost_reason_only_when_lost" check ("lost_reason" is null or "status" = 'lost'),
      add constraint "job_lost_reason_text" check ("lost_reason" is null or length(btrim("lost_reason")) between 1 and 80);`);
    this.addSql(`create table "company_loss_reasons" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "reasons" jsonb not null check (jsonb_typeof("reasons") = 'array' and jsonb_array_length("reasons") between 1 and 20),
      "version" integer not null default 1 check ("version" >= 1),
      "updated_at" timestamptz not null,
      constraint "company_loss_reasons_company_unique" unique ("company_id")
    );`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "company_loss_reasons";`);
    this.addSql(`alter table "job" drop constraint "job_lost_reason_text",
      drop constraint "job_lost_reason_only_when_lost", drop column "lost_reason";`);
  }
}
