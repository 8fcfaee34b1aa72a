import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 14 (after14): a buyer's cancellation of a signed proposal within the three business days of
 * 16 CFR 429.1(a). One row per signed version (`version_id` unique: cancelling twice is refused by the
 * database too), insert-only like the audit trail (a trigger refuses UPDATE and DELETE), with who and how:
 * the buyer on the proposal's page (`by_customer`, the IP and user agent of that request), or the office
 * recording a notice the buyer mailed or handed over (`by_user_id`, and `sent_on`, the date the buyer
 * mailed or delivered it — 429.1(b): a notice mailed before the window's midnight counts). The refund of
 * the deposit lives on the `payment` row; the job's move to lost on the job.
 */
export class Migration20261209050000_proposal_cancellation extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "proposal_cancellation" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "proposal_id" uuid not null references "proposal" ("id") on update cascade on delete cascade,
      "version_id" uuid not null references "proposal_version" ("id") on update cascade on delete cascade,
      "at" timestamptz not null,
      "method" varchar(10) not null check ("method" in ('page', 'mail', 'delivered')),
      "sent_on" date null,
      "by_customer" boolean not null,
      "by_user_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "ip" varchar(45) null,
      "user_agent" varchar(400) null,
      "reason" varchar(1000) null check ("reason" is null or length(btrim("reason")) between 1 and 1000),
      "last_day_to_cancel" date not null,
      constraint "proposal_cancellation_version_unique" unique ("version_id"),
      constraint "proposal_cancellation_who" check (("by_customer" and "by_user_id" is null and "method" = 'page')
        or (not "by_customer" and "method" <> 'page' and "sent_on" is not null))
    );`);
    this.addSql(
      `create index "proposal_cancellation_company_proposal_index" on "proposal_cancellation" ("company_id", "proposal_id");`,
    );
    this.addSql(`create function "proposal_cancellation_insert_only"() returns trigger language plpgsql as $$
    begin
      raise exception 'a cancellation is recorded once and never changed or deleted (version %)', old."version_id"
        using errcode = 'check_violation';
    end $$;`);
    this.addSql(`create trigger "proposal_cancellation_insert_only" before update or delete on "proposal_cancellation"
      for each row execute function "proposal_cancellation_insert_only"();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "proposal_cancellation";`);
    this.addSql(`drop function if exists "proposal_cancellation_insert_only"();`);
  }
}
