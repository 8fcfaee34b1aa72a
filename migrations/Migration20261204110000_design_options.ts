import { Migration } from '@mikro-orm/migrations';

/**
 * The estimator's desk (issue 13): up to three priced options per job, each holding only inputs — the
 * design (calc's zones and systems), the pricing inputs, the takeoff edits (with the generated value each
 * was made against), the chosen models as they were when chosen (so a model retired or deleted later
 * keeps the option valid), a discount request awaiting the owner, and whether it is a first price from
 * the phone. Totals are never stored: the server recomputes them with calc. The job gets its "ready to
 * propose" mark (when and by whom). CHECKs repeat the contract's bounds (bad data is refused twice).
 */
export class Migration20261204110000_design_options extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "design_option" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "job_id" uuid not null references "job" ("id") on update cascade on delete cascade,
      "position" smallint not null check ("position" between 1 and 3),
      "name" varchar(60) not null check (length(btrim("name")) between 1 and 60),
      "design" jsonb null check ("design" is null or jsonb_typeof("design") = 'object'),
      "pricing" jsonb not null check (jsonb_typeof("pricing") = 'object'),
      "takeoff_edits" jsonb not null default '[]'::jsonb
        check (jsonb_typeof("takeoff_edits") = 'array' and jsonb_array_length("takeoff_edits") <= 200),
      "chosen_models" jsonb not null default '{}'::jsonb check (jsonb_typeof("chosen_models") = 'object'),
      "discount_request" jsonb null check ("discount_request" is null or (jsonb_typeof("discount_request") = 'object'
        and "discount_request"->>'state' in ('pending', 'approved', 'denied'))),
      "preliminary" boolean not null default false,
      "reviewed_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "reviewed_at" timestamptz null,
      "created_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "version" integer not null default 1 check ("version" >= 1),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      constraint "design_option_job_position_unique" unique ("job_id", "position")
    );`);
    this.addSql(`create index "design_option_company_id_index" on "design_option" ("company_id");`);
    this.addSql(`alter table "job"
      add column "ready_at" timestamptz null,
      add column "ready_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      add constraint "job_ready_by_when" check ("ready_at" is not null or "ready_by_id" is null);`);
  }

  override async down(): Promise<void> {
    this.addSql(
      `alter table "job" drop constraint "job_ready_by_when", drop column "ready_by_id", drop column "ready_at";`,
    );
    this.addSql(`drop table if exists "design_option" cascade;`);
  }
}
