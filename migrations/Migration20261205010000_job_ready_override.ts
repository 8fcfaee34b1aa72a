import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 13: a job is marked ready to propose with units outside their sizing range only when the office
 * gives a reason. The override (reason, who, when, the units it covers) is kept with the ready mark and
 * goes with it.
 */
export class Migration20261205010000_job_ready_override extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "job" add column "ready_override" jsonb null
      check ("ready_override" is null or (jsonb_typeof("ready_override") = 'object'
        and jsonb_typeof("ready_override"->'reason') = 'string'
        and length("ready_override"->>'reason') between 1 and 500
        and jsonb_typeof("ready_override"->'units') = 'array'));`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "job" drop column "ready_override";`);
  }
}
