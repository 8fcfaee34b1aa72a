import { Migration } from '@mikro-orm/migrations';

/**
 * Customers get the same optimistic lock as jobs and rooms: an integer version, sent as ETag and
 * required as If-Match on every update and delete (a stale one is a 409 with the customer as now).
 */
export class Migration20261204000200_customer_version extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "customer" add column "version" integer not null default 1 check ("version" >= 1);`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "customer" drop column "version";`);
  }
}
