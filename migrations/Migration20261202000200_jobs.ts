import { Migration } from '@mikro-orm/migrations';

/**
 * Customers, jobs, rooms, room photos and company settings. The CHECK constraints repeat
 * the zod bounds as a second layer; `version` columns carry the optimistic lock.
 */
export class Migration20261202000200_jobs extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "customer" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete restrict,
      "name" varchar(160) not null check (length(trim("name")) > 0),
      "email" varchar(254) null check ("email" is null or "email" like '%_@_%'),
      "phone" varchar(40) null,
      "notes" text not null default '' check (length("notes") <= 4000),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null
    );`);
    this.addSql(`create index "customer_company_id_index" on "customer" ("company_id");`);

    this.addSql(`create table "job" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete restrict,
      "customer_id" uuid not null references "customer" ("id") on update cascade on delete restrict,
      "salesperson_id" uuid not null references "app_user" ("id") on update cascade on delete restrict,
      "assigned_installer_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "status" text not null default 'walkthrough'
        check ("status" in ('walkthrough', 'design', 'proposed', 'won', 'lost', 'installed')),
      "street" varchar(200) not null check (length(trim("street")) > 0),
      "unit" varchar(60) not null default '',
      "city" varchar(100) not null check (length(trim("city")) > 0),
      "region" varchar(60) not null check (length(trim("region")) > 0),
      "postal_code" varchar(20) not null check (length(trim("postal_code")) > 0),
      "notes" text not null default '' check (length("notes") <= 4000),
      "design_conditions" jsonb null check ("design_conditions" is null or jsonb_typeof("design_conditions") = 'object'),
      "design_sources" jsonb not null default '{}' check (jsonb_typeof("design_sources") = 'object'),
      "tightness" text not null default 'average'
        check ("tightness" in ('very-tight', 'tight', 'average', 'leaky', 'very-leaky')),
      "version" integer not null default 1 check ("version" >= 1),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      "last_activity_at" timestamptz not null
    );`);
    this.addSql(`create index "job_company_id_index" on "job" ("company_id");`);
    this.addSql(`create index "job_customer_id_index" on "job" ("customer_id");`);
    this.addSql(`create index "job_salesperson_id_index" on "job" ("salesperson_id");`);
    this.addSql(`create index "job_assigned_installer_id_index" on "job" ("assigned_installer_id");`);
    this.addSql(`create index "job_last_activity_at_index" on "job" ("company_id", "last_activity_at" desc);`);

    this.addSql(`create table "room" (
      "id" uuid primary key,
      "job_id" uuid not null references "job" ("id") on update cascade on delete cascade,
      "position" integer not null default 0 check ("position" between 0 and 10000),
      "input" jsonb not null check (jsonb_typeof("input") = 'object' and "input"->>'id' = "id"::text),
      "version" integer not null default 1 check ("version" >= 1),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null
    );`);
    this.addSql(`create index "room_job_id_index" on "room" ("job_id");`);

    this.addSql(`create table "photo" (
      "id" uuid primary key,
      "room_id" uuid not null references "room" ("id") on update cascade on delete cascade,
      "storage_key" uuid not null,
      "content_type" varchar(40) not null check ("content_type" in ('image/jpeg')),
      "byte_size" integer not null check ("byte_size" between 1 and 52428800),
      "width" integer not null check ("width" between 1 and 20000),
      "height" integer not null check ("height" between 1 and 20000),
      "original_name" varchar(120) not null,
      "uploaded_by_id" uuid not null references "app_user" ("id") on update cascade on delete restrict,
      "created_at" timestamptz not null,
      constraint "photo_storage_key_unique" unique ("storage_key")
    );`);
    this.addSql(`create index "photo_room_id_index" on "photo" ("room_id");`);

    this.addSql(`create table "company_settings" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "default_design_conditions" jsonb null
        check ("default_design_conditions" is null or jsonb_typeof("default_design_conditions") = 'object'),
      "version" integer not null default 1 check ("version" >= 1),
      "updated_at" timestamptz not null,
      constraint "company_settings_company_id_unique" unique ("company_id")
    );`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "company_settings";');
    this.addSql('drop table if exists "photo";');
    this.addSql('drop table if exists "room";');
    this.addSql('drop table if exists "job";');
    this.addSql('drop table if exists "customer";');
  }
}
