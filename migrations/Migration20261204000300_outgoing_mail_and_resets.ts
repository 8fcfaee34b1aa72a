import { Migration } from '@mikro-orm/migrations';

/**
 * Outgoing e-mail kept with its delivery state (sent by the job queue, shown to the owner when it
 * keeps failing) and the password-reset tokens (only their SHA-256 is stored). graphile-worker's
 * own schema `graphile_worker` is installed by its own migrations (services/queue.ts, migrateQueue).
 */
export class Migration20261204000300_outgoing_mail_and_resets extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "outgoing_message" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete restrict,
      "user_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "kind" text not null check ("kind" in ('new-user', 'password-changed', 'password-reset')),
      "to_address" varchar(254) not null check ("to_address" like '%_@_%'),
      "subject" varchar(300) not null check (length(trim("subject")) > 0),
      "body_text" text null check ("body_text" is null or length("body_text") <= 20000),
      "state" text not null default 'waiting' check ("state" in ('waiting', 'retrying', 'failed', 'sent')),
      "attempts" integer not null default 0 check ("attempts" >= 0),
      "last_error" varchar(500) null,
      "next_attempt_at" timestamptz null,
      "sent_at" timestamptz null check (("state" = 'sent') = ("sent_at" is not null)),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      check ("kind" = 'password-reset' or "body_text" is not null)
    );`);
    this.addSql(
      `create index "outgoing_message_company_index" on "outgoing_message" ("company_id", "created_at" desc);`,
    );
    this.addSql(`create table "password_reset_token" (
      "id" uuid primary key,
      "user_id" uuid not null references "app_user" ("id") on update cascade on delete cascade,
      "token_hash" char(64) not null check ("token_hash" ~ '^[0-9a-f]{64}$'),
      "expires_at" timestamptz not null,
      "created_at" timestamptz not null,
      constraint "password_reset_token_hash_unique" unique ("token_hash"),
      check ("expires_at" > "created_at")
    );`);
    this.addSql(`create index "password_reset_token_user_index" on "password_reset_token" ("user_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "password_reset_token";`);
    this.addSql(`drop table if exists "outgoing_message";`);
  }
}
