import { Migration } from '@mikro-orm/migrations';

/**
 * Proposal links (issue 14, sending): each e-mail that sends a proposal version to a customer is one
 * `proposal_link`. Its token (32 random bytes, base64url) is made by the queue's worker at the moment the
 * e-mail goes out, and only its SHA-256 is stored: until then `token_sha256` is NULL, and a send that
 * fails rolls the token back with it (the password-reset pattern). A link ends when it expires, when the
 * office revokes it, or when its version is superseded. Every row carries company_id.
 *
 * outgoing_message learns the kind 'proposal-link', which, like 'password-reset', is stored without a
 * body: the body holds the one-time link, so it is made only as it is sent.
 */
const KINDS_BEFORE = ['new-user', 'password-changed', 'password-reset'];
const KINDS_AFTER = [...KINDS_BEFORE, 'proposal-link'];
const list = (xs: readonly string[]) => xs.map((x) => `'${x}'`).join(', ');
/** The body check was made without a name (PostgreSQL called it outgoing_message_check1): found by what it says. */
const dropBodyCheck = `do $$ declare c text; begin
  select conname into c from pg_constraint where conrelid = 'outgoing_message'::regclass and contype = 'c'
    and pg_get_constraintdef(oid) like '%body_text%' and pg_get_constraintdef(oid) like '%password-reset%';
  execute format('alter table "outgoing_message" drop constraint %I', c);
end $$;`;

export class Migration20261209030000_proposal_links extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "outgoing_message" drop constraint "outgoing_message_kind_check";`);
    this.addSql(dropBodyCheck);
    this.addSql(
      `alter table "outgoing_message" add constraint "outgoing_message_kind_check" check ("kind" in (${list(KINDS_AFTER)}));`,
    );
    this.addSql(
      `alter table "outgoing_message" add constraint "outgoing_message_body_check" check ("body_text" is not null or "kind" = 'password-reset' or "kind" = 'proposal-link');`,
    );

    this.addSql(`create table "proposal_link" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade on delete cascade,
      "proposal_id" uuid not null references "proposal" ("id") on update cascade on delete cascade,
      "version_id" uuid not null references "proposal_version" ("id") on update cascade on delete cascade,
      "message_id" uuid null references "outgoing_message" ("id") on update cascade on delete set null,
      "token_sha256" char(64) null check ("token_sha256" is null or "token_sha256" ~ '^[0-9a-f]{64}$'),
      "recipient" varchar(254) not null check ("recipient" like '%_@_%' and "recipient" !~ '[\\r\\n]'),
      "created_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      "created_at" timestamptz not null,
      "expires_at" timestamptz not null,
      "revoked_at" timestamptz null,
      "revoked_by_id" uuid null references "app_user" ("id") on update cascade on delete set null,
      constraint "proposal_link_token_unique" unique ("token_sha256"),
      check ("expires_at" > "created_at"),
      check ("revoked_at" is null or "revoked_at" >= "created_at")
    );`);
    this.addSql(`create index "proposal_link_proposal_index" on "proposal_link" ("proposal_id", "created_at" desc);`);
    this.addSql(`create index "proposal_link_company_index" on "proposal_link" ("company_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "proposal_link";`);
    this.addSql(`delete from "outgoing_message" where "kind" = 'proposal-link';`);
    this.addSql(`alter table "outgoing_message" drop constraint "outgoing_message_kind_check";`);
    this.addSql(`alter table "outgoing_message" drop constraint "outgoing_message_body_check";`);
    this.addSql(
      `alter table "outgoing_message" add constraint "outgoing_message_kind_check" check ("kind" in (${list(KINDS_BEFORE)}));`,
    );
    this.addSql(
      `alter table "outgoing_message" add constraint "outgoing_message_body_check" check ("kind" = 'password-reset' or "body_text" is not null);`,
    );
  }
}
