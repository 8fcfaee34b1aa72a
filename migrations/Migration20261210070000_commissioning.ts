import { Migration } from '@mikro-orm/migrations';

/**
 * The installer's commissioning record (issue 15, commission15).
 *
 * `commissioning_record`: one per job, versioned (If-Match); each part as entered (jsonb checked by the
 * contract's zod schemas in the service), the sign-off (installer, certification number as it was, the
 * customer's name and drawn acknowledgement in storage) and `installed_at` — once set the record is
 * read-only (a trigger refuses changes to the entered parts after it).
 * `refrigerant_entry`: one weighing in or out (added_oz, recovered_oz), by technician and time, with the
 * refrigerant, the cylinder or lot and additives; insert-only (a trigger refuses UPDATE/DELETE) so the
 * refrigerant log (reports15) reads what was entered.
 * `commissioning_amendment`: a correction after installation — who, when, what and why; insert-only.
 * `commissioning_policy`: the owner's evacuation policy and start-up readings (absent: the defaults).
 * `app_user.refrigerant_cert_number`: the technician's refrigerant-handling certification number.
 */
export class Migration20261210070000_commissioning extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "app_user" add column "refrigerant_cert_number" varchar(40) null;`);

    this.addSql(`create table "commissioning_policy" (
      "id" uuid primary key,
      "company_id" uuid not null unique references "company" ("id") on update cascade on delete cascade,
      "target_microns" integer not null check ("target_microns" between 50 and 5000),
      "max_rise_to_microns" integer not null check ("max_rise_to_microns" between 100 and 5000),
      "hold_minutes" integer not null check ("hold_minutes" between 1 and 240),
      "startup_readings" jsonb not null check (jsonb_typeof("startup_readings") = 'array'),
      "ask_lot" boolean not null default false,
      "version" integer not null default 1 check ("version" >= 1),
      "updated_at" timestamptz not null
    );`);

    this.addSql(`create table "commissioning_record" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade,
      "job_id" uuid not null unique references "job" ("id") on update cascade on delete cascade,
      "version" integer not null default 1 check ("version" >= 1),
      "pressure_test" jsonb not null check (jsonb_typeof("pressure_test") = 'object'),
      "leaks" jsonb not null check (jsonb_typeof("leaks") = 'array'),
      "evacuation" jsonb not null check (jsonb_typeof("evacuation") = 'object'),
      "measured_lines" jsonb not null check (jsonb_typeof("measured_lines") = 'array'),
      "startup" jsonb not null check (jsonb_typeof("startup") = 'array'),
      "notes" text not null default '' check (char_length("notes") <= 4000),
      "signed_off_by_id" uuid null references "app_user" ("id") on update cascade,
      "signed_off_by_name" varchar(120) null,
      "cert_number" varchar(40) null,
      "customer_name" varchar(120) null,
      "customer_signature_key" varchar(300) null,
      "installed_at" timestamptz null,
      "changed_by_id" uuid null,
      "changed_by_name" varchar(120) null,
      "changed_on_device" varchar(40) null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      constraint "commissioning_record_signed_check" check (
        ("installed_at" is null) = ("signed_off_by_id" is null)
        and ("installed_at" is null) = ("cert_number" is null)
        and ("installed_at" is null) = ("customer_name" is null))
    );`);
    this.addSql(`create index "commissioning_record_company_index" on "commissioning_record" ("company_id");`);
    this.addSql(`create function "commissioning_record_read_only"() returns trigger language plpgsql as $$
      begin
        if old."installed_at" is not null then
          raise exception 'commissioning record % is signed off and read-only', old."id";
        end if;
        return new;
      end $$;`);
    this.addSql(`create trigger "commissioning_record_read_only" before update or delete on "commissioning_record"
      for each row execute function "commissioning_record_read_only"();`);

    this.addSql(`create table "refrigerant_entry" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade,
      "job_id" uuid not null references "job" ("id") on update cascade,
      "record_id" uuid not null references "commissioning_record" ("id") on update cascade,
      "system_key" varchar(80) not null,
      "refrigerant" varchar(20) not null,
      "added_oz" numeric(8, 2) not null check ("added_oz" >= 0),
      "recovered_oz" numeric(8, 2) not null check ("recovered_oz" >= 0),
      "technician_user_id" uuid not null references "app_user" ("id") on update cascade,
      "entered_at" timestamptz not null,
      "lot" varchar(60) null,
      "additives" varchar(200) null
    );`);
    this.addSql(`create index "refrigerant_entry_company_index" on "refrigerant_entry" ("company_id", "entered_at");`);
    this.addSql(`create index "refrigerant_entry_job_index" on "refrigerant_entry" ("job_id");`);

    this.addSql(`create table "commissioning_amendment" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade,
      "record_id" uuid not null references "commissioning_record" ("id") on update cascade,
      "by_user_id" uuid not null references "app_user" ("id") on update cascade,
      "by_name" varchar(120) not null,
      "what" varchar(120) not null,
      "correction" varchar(1000) not null,
      "reason" varchar(1000) not null check (char_length(btrim("reason")) > 0),
      "at" timestamptz not null
    );`);
    this.addSql(
      `create index "commissioning_amendment_record_index" on "commissioning_amendment" ("record_id", "at");`,
    );
    this.addSql(`create function "commissioning_insert_only"() returns trigger language plpgsql as $$
      begin
        raise exception '% is insert-only', tg_table_name;
      end $$;`);
    this.addSql(`create trigger "refrigerant_entry_insert_only" before update or delete on "refrigerant_entry"
      for each row execute function "commissioning_insert_only"();`);
    this
      .addSql(`create trigger "commissioning_amendment_insert_only" before update or delete on "commissioning_amendment"
      for each row execute function "commissioning_insert_only"();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "commissioning_amendment";`);
    this.addSql(`drop table if exists "refrigerant_entry";`);
    this.addSql(`drop table if exists "commissioning_record";`);
    this.addSql(`drop function if exists "commissioning_insert_only"();`);
    this.addSql(`drop function if exists "commissioning_record_read_only"();`);
    this.addSql(`drop table if exists "commissioning_policy";`);
    this.addSql(`alter table "app_user" drop column if exists "refrigerant_cert_number";`);
  }
}
