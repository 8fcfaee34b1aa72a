import { Migration } from '@mikro-orm/migrations';

/**
 * E-signatures (issue 14, the signing slice).
 *
 * `proposal_signature`: one row per signed version (version_id unique), written once in the transaction
 * that writes the `signed` audit event. It holds who signed (name, e-mail), how (a drawn mark kept in
 * storage, or a typed name), the option accepted, the acceptance statement shown and its SHA-256, the
 * SHA-256 of the version's PDF that was signed and of its snapshot, when (UTC), the IP and user agent.
 *
 * `proposal_signed_pdf`: the sealed PDF made afterwards by the queue (one per signature): its storage key,
 * SHA-256, size and the sealing certificate's fingerprint.
 *
 * Both are insert-only in PostgreSQL, not only in the code: a trigger refuses every UPDATE and DELETE.
 * Parents are referenced without ON DELETE CASCADE: a signed record is never removed with its job.
 *
 * outgoing_message gets an optional attachment (a stored file sent with the e-mail: the signed PDF) and the
 * kind 'signed-proposal', added to whatever list the kind CHECK holds now (another slice adds its own kind
 * at the same time; each keeps the other's).
 */
const addKind = `do $$
declare def text;
begin
  select pg_get_constraintdef(c.oid) into def from pg_constraint c
   where c.conname = 'outgoing_message_kind_check' and c.conrelid = 'outgoing_message'::regclass;
  if position('''signed-proposal''' in def) = 0 then
    execute 'alter table "outgoing_message" drop constraint "outgoing_message_kind_check"';
    execute 'alter table "outgoing_message" add constraint "outgoing_message_kind_check" '
      || replace(def, '::text])', '::text, ''signed-proposal''::text])');
  end if;
end $$;`;
const dropKind = `do $$
declare def text;
begin
  select pg_get_constraintdef(c.oid) into def from pg_constraint c
   where c.conname = 'outgoing_message_kind_check' and c.conrelid = 'outgoing_message'::regclass;
  execute 'alter table "outgoing_message" drop constraint "outgoing_message_kind_check"';
  execute 'alter table "outgoing_message" add constraint "outgoing_message_kind_check" '
    || replace(def, ', ''signed-proposal''::text', '');
end $$;`;

export class Migration20261209040000_proposal_signatures extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "proposal_signature" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade,
      "proposal_id" uuid not null references "proposal" ("id") on update cascade,
      "version_id" uuid not null references "proposal_version" ("id") on update cascade,
      "option_position" integer not null check ("option_position" between 1 and 3),
      "signer_name" varchar(120) not null check (char_length(btrim("signer_name")) between 1 and 120),
      "signer_email" varchar(254) not null check ("signer_email" ~ '^[^@\\s]+@[^@\\s]+$'),
      "method" varchar(5) not null check ("method" in ('drawn', 'typed')),
      "image_key" varchar(300) null,
      "typed_name" varchar(120) null,
      "statement" text not null check (char_length("statement") between 1 and 2000),
      "statement_sha256" char(64) not null check ("statement_sha256" ~ '^[0-9a-f]{64}$'),
      "document_sha256" char(64) not null check ("document_sha256" ~ '^[0-9a-f]{64}$'),
      "snapshot_sha256" char(64) not null check ("snapshot_sha256" ~ '^[0-9a-f]{64}$'),
      "consent_sha256" char(64) not null check ("consent_sha256" ~ '^[0-9a-f]{64}$'),
      "signed_at" timestamptz not null,
      "ip" varchar(45) null,
      "user_agent" varchar(400) null,
      constraint "proposal_signature_version_unique" unique ("version_id"),
      constraint "proposal_signature_mark" check (
        ("method" = 'drawn' and "image_key" is not null and "typed_name" is null)
        or ("method" = 'typed' and "image_key" is null and char_length(btrim("typed_name")) between 1 and 120))
    );`);
    this.addSql(`create index "proposal_signature_company_id_index" on "proposal_signature" ("company_id");`);
    this.addSql(`create index "proposal_signature_proposal_id_index" on "proposal_signature" ("proposal_id");`);

    this.addSql(`create table "proposal_signed_pdf" (
      "id" uuid primary key,
      "company_id" uuid not null references "company" ("id") on update cascade,
      "signature_id" uuid not null references "proposal_signature" ("id") on update cascade,
      "storage_key" varchar(300) not null check (length("storage_key") between 1 and 300),
      "sha256" char(64) not null check ("sha256" ~ '^[0-9a-f]{64}$'),
      "bytes" integer not null check ("bytes" > 0),
      "certificate_sha256" char(64) not null check ("certificate_sha256" ~ '^[0-9a-f]{64}$'),
      "sealed_at" timestamptz not null,
      constraint "proposal_signed_pdf_signature_unique" unique ("signature_id")
    );`);
    this.addSql(`create index "proposal_signed_pdf_company_id_index" on "proposal_signed_pdf" ("company_id");`);

    this.addSql(`create function "proposal_signature_insert_only"() returns trigger language plpgsql as $$
    begin
      raise exception '% is insert-only: a signature and its sealed PDF are never changed or deleted', tg_table_name
        using errcode = 'check_violation';
    end $$;`);
    this.addSql(`create trigger "proposal_signature_insert_only" before update or delete on "proposal_signature"
      for each row execute function "proposal_signature_insert_only"();`);
    this.addSql(`create trigger "proposal_signed_pdf_insert_only" before update or delete on "proposal_signed_pdf"
      for each row execute function "proposal_signature_insert_only"();`);

    this.addSql(`alter table "outgoing_message"
      add column "attachment_key" varchar(300) null,
      add column "attachment_name" varchar(120) null,
      add constraint "outgoing_message_attachment" check (("attachment_key" is null) = ("attachment_name" is null));`);
    this.addSql(addKind);
  }

  override async down(): Promise<void> {
    this.addSql(`delete from "outgoing_message" where "kind" = 'signed-proposal';`);
    this.addSql(dropKind);
    this.addSql(`alter table "outgoing_message" drop constraint "outgoing_message_attachment",
      drop column "attachment_key", drop column "attachment_name";`);
    this.addSql(`drop table if exists "proposal_signed_pdf";`);
    this.addSql(`drop table if exists "proposal_signature";`);
    this.addSql(`drop function if exists "proposal_signature_insert_only"();`);
  }
}
