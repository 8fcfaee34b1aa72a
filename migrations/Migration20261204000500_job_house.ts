import { Migration } from '@mikro-orm/migrations';

/**
 * The whole-house facts the hour-by-hour loads use beyond the rooms (issue 9): bedrooms (62.2
 * ventilation, default occupants), a blower-door CFM50 and the ventilation system. One jsonb object
 * checked by calc's `houseSchema`; the CHECKs repeat its bounds so bad data is refused twice.
 */
export class Migration20261204000500_job_house extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "job" add column "house" jsonb not null default '{}'::jsonb
      check (jsonb_typeof("house") = 'object')
      check ("house"->'bedrooms' is null or (jsonb_typeof("house"->'bedrooms') = 'number'
        and ("house"->>'bedrooms')::numeric between 0 and 20))
      check ("house"->'blowerDoorCfm50' is null or (jsonb_typeof("house"->'blowerDoorCfm50') = 'number'
        and ("house"->>'blowerDoorCfm50')::numeric between 50 and 20000))
      check ("house"->'ventilation' is null or (jsonb_typeof("house"->'ventilation') = 'object'
        and "house"->'ventilation'->>'kind' in ('none', 'exhaust', 'supply', 'balanced', 'erv-hrv')));`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "job" drop column "house";`);
  }
}
