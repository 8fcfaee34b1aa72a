import { Migration } from '@mikro-orm/migrations';

/**
 * Issue 14: the proposal tables have landed (…070000_proposals), so a payment's proposal and version
 * become foreign keys. A payment row whose version does not exist can only be a test's (no version
 * existed before the proposal tables); it is removed with its webhook events' link to it.
 */
export class Migration20261208090100_payment_proposal_keys extends Migration {
  override async up(): Promise<void> {
    this.addSql(`delete from "payment" p where not exists (
      select 1 from "proposal_version" v where v."id" = p."proposal_version_id" and v."proposal_id" = p."proposal_id"
        and v."company_id" = p."company_id");`);
    this.addSql(`alter table "payment"
      add constraint "payment_proposal_id_foreign" foreign key ("proposal_id")
        references "proposal" ("id") on update cascade on delete restrict,
      add constraint "payment_proposal_version_id_foreign" foreign key ("proposal_version_id")
        references "proposal_version" ("id") on update cascade on delete restrict;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "payment" drop constraint "payment_proposal_version_id_foreign",
      drop constraint "payment_proposal_id_foreign";`);
  }
}
