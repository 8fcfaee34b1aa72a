import { Migration } from '@mikro-orm/migrations';

/**
 * Who last changed a room, a job or a customer, and on which device (issue 10: a conflict says "changed
 * on another device at 14:32 by …"). The person is kept by id and by the name they had then (a person
 * who leaves is deactivated, rarely deleted: then the id goes and the name stays). The device is the
 * opaque label a browser makes for itself once (no make, model or address), only ever shown to the
 * same company's people with the record it came with.
 */
export class Migration20261205060000_change_stamps extends Migration {
  override async up(): Promise<void> {
    for (const table of ['room', 'job', 'customer']) {
      this.addSql(`alter table "${table}"
        add column "changed_by_id" uuid null references "app_user" ("id") on delete set null,
        add column "changed_by_name" varchar(120) null check (char_length("changed_by_name") between 1 and 120),
        add column "changed_on_device" varchar(40) null check ("changed_on_device" ~ '^[A-Za-z0-9-]{8,40}$');`);
    }
  }

  override async down(): Promise<void> {
    for (const table of ['room', 'job', 'customer']) {
      this.addSql(`alter table "${table}" drop column "changed_by_id", drop column "changed_by_name",
        drop column "changed_on_device";`);
    }
  }
}
