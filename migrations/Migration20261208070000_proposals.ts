import { Migration } from '@mikro-orm/migrations';

/**
 * Proposals (issue 14): one proposal per job, its frozen versions and its audit trail.
 *
 * A version's snapshot is everything the customer is offered, worked out by the server with calc from the
 * saved inputs at the moment of issuing (contract/proposal.ts `proposalSnapshot`), with the SHA-256 of its
 * canonical JSON. PostgreSQL keeps it frozen, not only the code: the trigger below refuses DELETE and any
 * UPDATE of a frozen column; it allows `superseded_at` to go from NULL to a time once, and the PDF columns
 * (pdf_state, pdf_sha256, pdf_key) to change while pdf_sha256 is NULL (once the PDF's hash is recorded,
 * they are fixed too). The audit trail is ordered by `seq` (an identity) and is insert-only as well.
 * Every row carries company_id (tenant isolation: every query filters by it).
 */
export class Migration20261208070000_proposals extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "proposal" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "job_id" uuid not null references "job" ("id") on update cascade on delete cascade,
      "created_at" timestamptz not null,
      constraint "proposal_job_unique" unique ("job_id")
    );`);
    this.addSql(`create index "proposal_company_id_index" on "proposal" ("company_id");`);

    this.addSql(`create table "proposal_version" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "proposal_id" uuid not null references "proposal" ("id") on update cascade on delete cascade,
      "number" integer not null check ("number" >= 1),
      "snapshot" jsonb not null check (jsonb_typeof("snapshot") = 'object'),
      "snapshot_sha256" char(64) not null check ("snapshot_sha256" ~ '^[0-9a-f]{64}$'),
      "calc_version" varchar(40) not null check (length(btrim("calc_version")) between 1 and 40),
      "issued_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "issued_by_name" varchar(120) not null check (char_length("issued_by_name") between 1 and 120),
      "issued_at" timestamptz not null,
      "superseded_at" timestamptz null check ("superseded_at" is null or "superseded_at" >= "issued_at"),
      "pdf_state" varchar(10) not null default 'waiting'
        check ("pdf_state" in ('waiting', 'rendering', 'ready', 'failed')),
      "pdf_sha256" char(64) null check ("pdf_sha256" is null or "pdf_sha256" ~ '^[0-9a-f]{64}$'),
      "pdf_key" varchar(300) null check ("pdf_key" is null or length("pdf_key") between 1 and 300),
      constraint "proposal_version_pdf_ready" check (("pdf_state" = 'ready') = ("pdf_sha256" is not null and "pdf_key" is not null)),
      constraint "proposal_version_number_unique" unique ("proposal_id", "number")
    );`);
    this.addSql(`create index "proposal_version_company_id_index" on "proposal_version" ("company_id");`);
    // At most one current (not superseded) version per proposal.
    this.addSql(`create unique index "proposal_version_one_current" on "proposal_version" ("proposal_id")
      where "superseded_at" is null;`);

    this.addSql(`create table "proposal_event" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "proposal_id" uuid not null references "proposal" ("id") on update cascade on delete cascade,
      "version_id" uuid null references "proposal_version" ("id") on update cascade on delete cascade,
      "seq" bigint generated always as identity unique,
      "kind" varchar(20) not null check ("kind" in ('issued', 'superseded', 'sent', 'send-failed', 'opened',
        'viewed', 'downloaded', 'option-chosen', 'consented', 'signed', 'paid', 'refunded', 'cancelled',
        'link-revoked', 'marked-lost')),
      "at" timestamptz not null,
      "by_user_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "by_customer" boolean not null default false,
      "ip" varchar(45) null,
      "user_agent" varchar(400) null,
      "data" jsonb not null default '{}'::jsonb check (jsonb_typeof("data") = 'object'),
      constraint "proposal_event_who" check (not ("by_customer" and "by_user_id" is not null))
    );`);
    this.addSql(`create index "proposal_event_company_id_index" on "proposal_event" ("company_id");`);
    this.addSql(`create index "proposal_event_proposal_seq_index" on "proposal_event" ("proposal_id", "seq");`);

    this.addSql(`create function "proposal_version_frozen"() returns trigger language plpgsql as $$
    begin
      if tg_op = 'DELETE' then
        raise exception 'proposal version % is frozen: a version is never deleted', old."number"
          using errcode = 'check_violation', hint = 'Issue a new version instead.';
      end if;
      if new."id" is distinct from old."id" or new."company_id" is distinct from old."company_id"
        or new."proposal_id" is distinct from old."proposal_id" or new."number" is distinct from old."number"
        or new."snapshot" is distinct from old."snapshot" or new."snapshot_sha256" is distinct from old."snapshot_sha256"
        or new."calc_version" is distinct from old."calc_version" or new."issued_by_id" is distinct from old."issued_by_id"
        or new."issued_by_name" is distinct from old."issued_by_name" or new."issued_at" is distinct from old."issued_at" then
        raise exception 'proposal version % is frozen: its snapshot, number and issuing are never changed', old."number"
          using errcode = 'check_violation', hint = 'Issue a new version instead.';
      end if;
      if old."superseded_at" is not null and new."superseded_at" is distinct from old."superseded_at" then
        raise exception 'proposal version % is frozen: it was superseded at %, and that stays', old."number", old."superseded_at"
          using errcode = 'check_violation';
      end if;
      if old."pdf_sha256" is not null and (new."pdf_state" is distinct from old."pdf_state"
        or new."pdf_sha256" is distinct from old."pdf_sha256" or new."pdf_key" is distinct from old."pdf_key") then
        raise exception 'proposal version % is frozen: its PDF is recorded (sha256 %) and stays', old."number", old."pdf_sha256"
          using errcode = 'check_violation';
      end if;
      return new;
    end $$;`);
    this.addSql(`create trigger "proposal_version_frozen" before update or delete on "proposal_version"
      for each row execute function "proposal_version_frozen"();`);

    this.addSql(`create function "proposal_event_insert_only"() returns trigger language plpgsql as $$
    begin
      raise exception 'the proposal audit trail is insert-only: event % is never changed or deleted', old."seq"
        using errcode = 'check_violation';
    end $$;`);
    this.addSql(`create trigger "proposal_event_insert_only" before update or delete on "proposal_event"
      for each row execute function "proposal_event_insert_only"();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "proposal_event" cascade;`);
    this.addSql(`drop table if exists "proposal_version" cascade;`);
    this.addSql(`drop table if exists "proposal" cascade;`);
    this.addSql(`drop function if exists "proposal_event_insert_only"();`);
    this.addSql(`drop function if exists "proposal_version_frozen"();`);
  }
}
