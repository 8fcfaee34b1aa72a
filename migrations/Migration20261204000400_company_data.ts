import { Migration } from '@mikro-orm/migrations';

/**
 * The company's equipment catalog and price book. Every table of it (models, materials,
 * labor, kits, categories, financing, refrigerants, discount limits) is one row per record
 * in `company_data_row`, its shape checked by calc's schema for that table (the JSON is the
 * parsed record); `company_data_change` keeps who changed what, when, cell by cell; the tax
 * and the default sell rule live in `price_book_settings`.
 */
export class Migration20261204000400_company_data extends Migration {
  override async up(): Promise<void> {
    const datasets = `('models', 'materials', 'labor', 'kits', 'categories', 'financing', 'refrigerants', 'discount-limits')`;
    this.addSql(`create table "company_data_row" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "dataset" text not null check ("dataset" in ${datasets}),
      "key" varchar(80) not null check (length("key") > 0 and "key" ~ '^[A-Za-z0-9._:/-]+$'),
      "data" jsonb not null check (jsonb_typeof("data") = 'object' and "data"->>'key' = "key"),
      "version" integer not null default 1 check ("version" >= 1),
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      constraint "company_data_row_company_dataset_key_unique" unique ("company_id", "dataset", "key")
    );`);

    this.addSql(`create table "company_data_change" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "dataset" text not null check ("dataset" in ${datasets}),
      "key" varchar(80) not null,
      "action" text not null check ("action" in ('created', 'changed')),
      "source" text not null check ("source" in ('edit', 'import', 'seed')),
      "changes" jsonb not null check (jsonb_typeof("changes") = 'array'),
      "changed_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "changed_at" timestamptz not null
    );`);
    this.addSql(
      `create index "company_data_change_lookup_index" on "company_data_change" ("company_id", "dataset", "key", "changed_at" desc);`,
    );

    this.addSql(`create table "price_book_settings" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "data" jsonb not null check (jsonb_typeof("data") = 'object'),
      "version" integer not null default 1 check ("version" >= 1),
      "updated_at" timestamptz not null,
      constraint "price_book_settings_company_id_unique" unique ("company_id")
    );`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "price_book_settings";');
    this.addSql('drop table if exists "company_data_change";');
    this.addSql('drop table if exists "company_data_row";');
  }
}
