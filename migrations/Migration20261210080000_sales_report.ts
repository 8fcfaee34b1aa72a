import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 15 (reports15): the owner's sales reports read a summary kept beside the real rows.
 *
 * `sales_report_proposal`: one row per proposal — its job's salesperson, the first visit (the job's creation),
 * the first price (the job's first desk option), when it was first and last issued, its outcome (outstanding,
 * won, lost), when it was decided and signed, the option signed and its revenue, the lost reason, and the
 * buyer's cancellation within the three-day window.
 * `sales_report_option`: one row per option of the proposal's latest version (or of the signed version): its
 * position, system type, capacity at design ÷ block load, its price, and whether it was the one signed.
 *
 * The rows are worked out by the application (modules/reports/sales-summary.ts: the capacity at the design
 * temperature comes from calc and the catalog's capacity points), never written by hand. The real paths mark
 * a proposal stale through the triggers below — a version issued, a signature, a cancellation, the job's status,
 * lost reason or salesperson changing, a desk option added — and the report refreshes the stale ones of the
 * company before it reads. So every path that moves a job through the product (the services, the seed, a
 * future one) is counted without each of them calling the reports.
 */
export class Migration20261210080000_sales_report extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "sales_report_proposal" (
      "proposal_id" uuid primary key references "proposal" ("id") on update cascade on delete cascade,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "job_id" uuid not null references "job" ("id") on update cascade on delete cascade,
      "salesperson_id" uuid not null references "app_user" ("id") on update cascade on delete cascade,
      "first_visit_at" timestamptz not null,
      "first_priced_at" timestamptz null,
      "first_issued_at" timestamptz not null,
      "last_issued_at" timestamptz not null,
      "outcome" varchar(12) not null check ("outcome" in ('outstanding', 'won', 'lost')),
      "decided_at" timestamptz null,
      "signed_at" timestamptz null,
      "option_position" smallint null check ("option_position" is null or "option_position" between 1 and 3),
      "revenue_cents" bigint null check ("revenue_cents" is null or "revenue_cents" >= 0),
      "lost_reason" varchar(80) null,
      "cancelled_at" timestamptz null,
      "refreshed_at" timestamptz not null,
      constraint "sales_report_proposal_decided" check (("outcome" = 'outstanding') = ("decided_at" is null)),
      constraint "sales_report_proposal_revenue" check ("revenue_cents" is null or "outcome" = 'won')
    );`);
    this.addSql(`create index "sales_report_proposal_company_issued_index"
      on "sales_report_proposal" ("company_id", "first_issued_at");`);
    this.addSql(`create index "sales_report_proposal_company_salesperson_issued_index"
      on "sales_report_proposal" ("company_id", "salesperson_id", "first_issued_at");`);

    this.addSql(`create table "sales_report_option" (
      "proposal_id" uuid not null references "sales_report_proposal" ("proposal_id") on update cascade on delete cascade,
      "position" smallint not null check ("position" between 1 and 3),
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "system_type" varchar(12) not null check ("system_type" in ('single-zone', 'multi-zone', 'ducted', 'mixed')),
      "capacity_btuh" numeric(12, 1) null check ("capacity_btuh" is null or "capacity_btuh" >= 0),
      "block_load_btuh" numeric(12, 1) null check ("block_load_btuh" is null or "block_load_btuh" > 0),
      "sizing_ratio" numeric(7, 3) null check ("sizing_ratio" is null or "sizing_ratio" >= 0),
      "total_cents" bigint not null check ("total_cents" >= 0),
      "chosen" boolean not null,
      primary key ("proposal_id", "position")
    );`);
    this.addSql(`create index "sales_report_option_company_index" on "sales_report_option" ("company_id");`);

    this.addSql(`create table "sales_report_stale" (
      "proposal_id" uuid primary key references "proposal" ("id") on update cascade on delete cascade,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "marked_at" timestamptz not null default now()
    );`);
    this.addSql(`create index "sales_report_stale_company_index" on "sales_report_stale" ("company_id");`);

    // The marks. Each trigger names the proposal a fact belongs to; the report refreshes it before reading.
    this.addSql(`create function "sales_report_mark_proposal"() returns trigger language plpgsql as $$
    begin
      insert into "sales_report_stale" ("proposal_id", "company_id") values (new."proposal_id", new."company_id")
        on conflict ("proposal_id") do update set "marked_at" = now();
      return null;
    end $$;`);
    this.addSql(`create function "sales_report_mark_job"() returns trigger language plpgsql as $$
    begin
      insert into "sales_report_stale" ("proposal_id", "company_id")
        select p."id", p."company_id" from "proposal" p where p."job_id" = new."job_id"
        on conflict ("proposal_id") do update set "marked_at" = now();
      return null;
    end $$;`);
    this.addSql(`create function "sales_report_mark_job_row"() returns trigger language plpgsql as $$
    begin
      insert into "sales_report_stale" ("proposal_id", "company_id")
        select p."id", p."company_id" from "proposal" p where p."job_id" = new."id"
        on conflict ("proposal_id") do update set "marked_at" = now();
      return null;
    end $$;`);
    for (const table of ['proposal_version', 'proposal_signature', 'proposal_cancellation'])
      this.addSql(`create trigger "${table}_sales_report" after insert on "${table}"
        for each row execute function "sales_report_mark_proposal"();`);
    this.addSql(`create trigger "design_option_sales_report" after insert on "design_option"
      for each row execute function "sales_report_mark_job"();`);
    this.addSql(`create trigger "job_sales_report" after update of "status", "lost_reason", "salesperson_id" on "job"
      for each row when (old."status" is distinct from new."status" or old."lost_reason" is distinct from new."lost_reason"
        or old."salesperson_id" is distinct from new."salesperson_id")
      execute function "sales_report_mark_job_row"();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists "job_sales_report" on "job";`);
    this.addSql(`drop trigger if exists "design_option_sales_report" on "design_option";`);
    for (const table of ['proposal_version', 'proposal_signature', 'proposal_cancellation'])
      this.addSql(`drop trigger if exists "${table}_sales_report" on "${table}";`);
    this.addSql(`drop function if exists "sales_report_mark_job_row"();`);
    this.addSql(`drop function if exists "sales_report_mark_job"();`);
    this.addSql(`drop function if exists "sales_report_mark_proposal"();`);
    this.addSql(`drop table if exists "sales_report_stale";`);
    this.addSql(`drop table if exists "sales_report_option";`);
    this.addSql(`drop table if exists "sales_report_proposal";`);
  }
}
