import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 14: what the company puts on every proposal (company settings, owner only). One row of texts per
 * company (address, phone, e-mail, licence, terms, warranty, the extra cancellation wording a state's law
 * adds), version-locked like the other settings, and the logo apart (its own row, so an upload never makes
 * the texts' form stale). Issuing copies them into the frozen snapshot, logo key included. The CHECKs repeat
 * the contract's limits (contract/proposal-details.ts) so bad data is refused twice.
 */
export class Migration20261209020000_company_proposal_details extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "company_proposal_details" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "address" varchar(400) not null default '',
      "phone" varchar(40) not null default '',
      "email" varchar(254) not null default '',
      "licence" varchar(300) not null default '',
      "terms" text not null default '' check (char_length("terms") <= 20000),
      "warranty" text not null default '' check (char_length("warranty") <= 20000),
      "cancellation_extra" text not null default '' check (char_length("cancellation_extra") <= 20000),
      "version" integer not null default 1 check ("version" >= 1),
      "updated_at" timestamptz not null,
      constraint "company_proposal_details_company_id_unique" unique ("company_id")
    );`);
    this.addSql(`create table "company_logo" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "storage_key" uuid not null,
      "content_type" varchar(40) not null check ("content_type" in ('image/png')),
      "byte_size" integer not null check ("byte_size" between 1 and 52428800),
      "width" integer not null check ("width" between 1 and 20000),
      "height" integer not null check ("height" between 1 and 20000),
      "uploaded_by_id" uuid not null references "app_user" ("id") on update cascade on delete restrict,
      "uploaded_at" timestamptz not null,
      constraint "company_logo_company_id_unique" unique ("company_id"),
      constraint "company_logo_storage_key_unique" unique ("storage_key")
    );`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "company_logo";');
    this.addSql('drop table if exists "company_proposal_details";');
  }
}
