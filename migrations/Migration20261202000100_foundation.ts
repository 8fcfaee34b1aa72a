import { Migration } from '@mikro-orm/migrations';

/** Companies (tenants), users, the session store and the sign-in rate-limit counters. */
export class Migration20261202000100_foundation extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "company" (
      "id" uuid primary key,
      "name" varchar(160) not null check (length(trim("name")) > 0),
      "unit_system" text not null default 'imperial' check ("unit_system" in ('imperial', 'metric')),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null
    );`);
    this.addSql(`create table "app_user" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete restrict,
      "name" varchar(120) not null check (length(trim("name")) > 0),
      "email" varchar(254) not null,
      "role" text not null check ("role" in ('owner', 'estimator', 'salesperson', 'installer')),
      "active" boolean not null default true,
      "password_hash" varchar(255) not null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      constraint "app_user_email_unique" unique ("email"),
      constraint "app_user_email_lower" check ("email" = lower("email"))
    );`);
    this.addSql(`create index "app_user_company_id_index" on "app_user" ("company_id");`);
    this.addSql(`create table "session" (
      "sid" varchar not null collate "default" primary key,
      "sess" json not null,
      "expire" timestamp(6) not null
    );`);
    this.addSql(`create index "session_expire_index" on "session" ("expire");`);
    this.addSql(`create index "session_user_index" on "session" ((sess->>'userId'));`);
    this.addSql(`create table "rate_limit" (
      "key" varchar(255) primary key,
      "points" integer not null default 0,
      "expire" bigint
    );`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "rate_limit";');
    this.addSql('drop table if exists "session";');
    this.addSql('drop table if exists "app_user";');
    this.addSql('drop table if exists "company";');
  }
}
