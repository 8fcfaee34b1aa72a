import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 14, the deposit: one payment row per proposal version (the payment service's intent, its state
 * and its refund), and every webhook event id the app has handled, so the same event sent twice is
 * applied once (the event row carries its company once its payment is known). proposal_id and proposal_version_id become foreign keys when the proposal tables land.
 */
export class Migration20261208090000_payments extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "payment" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete restrict,
      "proposal_id" uuid not null,
      "proposal_version_id" uuid not null unique,
      "amount_cents" integer not null check ("amount_cents" > 0),
      "currency" text not null default 'usd' check ("currency" ~ '^[a-z]{3}$'),
      "intent_id" varchar(255) not null unique,
      "state" text not null default 'created' check ("state" in ('created', 'succeeded', 'failed', 'refunded')),
      "failure" varchar(500) null,
      "refund_id" varchar(255) null,
      "paid_at" timestamptz null,
      "refunded_at" timestamptz null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      check (("state" in ('succeeded', 'refunded')) = ("paid_at" is not null)),
      check (("state" = 'refunded') = ("refunded_at" is not null))
    );`);
    this.addSql(`create index "payment_company_index" on "payment" ("company_id", "created_at" desc);`);
    this.addSql(`create table "payment_webhook_event" (
      "event_id" varchar(255) primary key,
      "type" varchar(255) not null,
      "company_id" uuid null references "company" ("id") on update cascade on delete restrict,
      "payment_id" uuid null references "payment" ("id") on update cascade on delete set null,
      "outcome" text not null default 'received'
        check ("outcome" in ('received', 'applied', 'unchanged', 'ignored', 'unknown-intent', 'mismatch')),
      "received_at" timestamptz not null
    );`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "payment_webhook_event";`);
    this.addSql(`drop table if exists "payment";`);
  }
}
