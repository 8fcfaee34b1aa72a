import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 15 (pack15): the installers scheduled on a won job. One row per installer per job (unique
 * (job_id, user_id)) with the day they work it; the office replaces the whole set at once
 * (`PUT /api/jobs/:jobId/assignments`). An installer sees a job when a row names them (or when the job's
 * `assigned_installer_id` does: the job details' single installer, kept as it was). The service checks that
 * the person is an active installer of the job's company and that the job is won; the database keeps the
 * tenant on the row and the day inside a sane range.
 */
export class Migration20261210060000_job_assignment extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "job_assignment" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "job_id" uuid not null references "job" ("id") on update cascade on delete cascade,
      "user_id" uuid not null references "app_user" ("id") on update cascade on delete cascade,
      "day" date not null check ("day" between date '2000-01-01' and date '2200-12-31'),
      "created_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "created_at" timestamptz not null,
      constraint "job_assignment_job_user_unique" unique ("job_id", "user_id")
    );`);
    this.addSql(
      `create index "job_assignment_company_user_day_index" on "job_assignment" ("company_id", "user_id", "day");`,
    );
    this.addSql(`create index "job_assignment_user_job_index" on "job_assignment" ("user_id", "job_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "job_assignment";`);
  }
}
