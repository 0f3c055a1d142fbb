// The build's inbox: a private token per build (existing builds get one from gen_random_uuid's random bits), the tokens
// it used before, the mail it did not accept with the reason, and the messages it accepted (one receipt set each).
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202170000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "build" add column "inbox_token" varchar(64) null;`);
    this.addSql(`update "build" set "inbox_token" = replace(gen_random_uuid()::text, '-', '');`);
    this.addSql(`alter table "build" alter column "inbox_token" set not null;`);
    this.addSql(`alter table "build" add constraint "build_inbox_token_unique" unique ("inbox_token");`);

    this.addSql(`create table "retired_inbox_token" ("token" varchar(64) not null, "build_id" uuid not null, "retired_at" timestamptz not null default now(), constraint "retired_inbox_token_pkey" primary key ("token"));`);
    this.addSql(`create index "retired_inbox_token_build_id_index" on "retired_inbox_token" ("build_id");`);
    this.addSql(`alter table "retired_inbox_token" add constraint "retired_inbox_token_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);

    this.addSql(`create table "mail_refusal" ("id" uuid not null, "build_id" uuid null, "from_address" varchar(254) not null, "recipient" varchar(254) not null, "subject" varchar(300) not null, "message_id" varchar(998) not null default '', "reason" text check ("reason" in ('unknown_address', 'old_address', 'not_a_member', 'reviewer', 'archived', 'refused_attachment', 'nothing_to_read')) not null, "detail" text not null, "received_at" timestamptz not null default now(), constraint "mail_refusal_pkey" primary key ("id"));`);
    this.addSql(`create index "mail_refusal_build_id_received_at_index" on "mail_refusal" ("build_id", "received_at");`);
    this.addSql(`alter table "mail_refusal" add constraint "mail_refusal_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);

    this.addSql(`create table "mailed_message" ("id" uuid not null, "build_id" uuid not null, "sender_id" uuid not null, "message_id" varchar(998) not null default '', "content_sha256" varchar(64) not null, "receipt_ids" jsonb not null default '[]', "received_at" timestamptz not null default now(), constraint "mailed_message_pkey" primary key ("id"));`);
    // Either key alone marks a repeat: the same Message-ID sent again, or the same content forwarded under a new one.
    this.addSql(`create unique index "mailed_message_build_message_id_unique" on "mailed_message" ("build_id", "message_id") where "message_id" <> '';`);
    this.addSql(`create unique index "mailed_message_build_content_unique" on "mailed_message" ("build_id", "content_sha256");`);
    this.addSql(`alter table "mailed_message" add constraint "mailed_message_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "mailed_message" add constraint "mailed_message_sender_id_foreign" foreign key ("sender_id") references "app_user" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "mailed_message" cascade;`);
    this.addSql(`drop table if exists "mail_refusal" cascade;`);
    this.addSql(`drop table if exists "retired_inbox_token" cascade;`);
    this.addSql(`alter table "build" drop constraint if exists "build_inbox_token_unique";`);
    this.addSql(`alter table "build" drop column if exists "inbox_token";`);
  }

}
