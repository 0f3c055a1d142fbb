// Accounts, builds, memberships, invites and the session table.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202020458 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "build" ("id" uuid not null, "name" varchar(120) not null, "vehicle" varchar(200) not null default '', "currency" varchar(3) not null, "locale" varchar(35) not null default 'en-US', "status" text check ("status" in ('planning', 'active', 'finished', 'sold')) not null default 'planning', "started_on" date null, "target_date" date null, "archived_at" timestamptz null, "version" int not null default 1, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "build_pkey" primary key ("id"));`);

    this.addSql(`create table "app_user" ("id" uuid not null, "email" varchar(254) not null, "display_name" varchar(80) not null, "password_hash" text not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "app_user_pkey" primary key ("id"));`);
    this.addSql(`alter table "app_user" add constraint "app_user_email_unique" unique ("email");`);

    this.addSql(`create table "password_reset" ("id" uuid not null, "user_id" uuid not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, "created_at" timestamptz not null default now(), constraint "password_reset_pkey" primary key ("id"));`);
    this.addSql(`alter table "password_reset" add constraint "password_reset_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "membership" ("id" uuid not null, "build_id" uuid not null, "user_id" uuid not null, "role" text check ("role" in ('owner', 'crew', 'reviewer')) not null, "created_at" timestamptz not null default now(), constraint "membership_pkey" primary key ("id"));`);
    this.addSql(`alter table "membership" add constraint "membership_build_id_user_id_unique" unique ("build_id", "user_id");`);

    this.addSql(`create table "invite" ("id" uuid not null, "build_id" uuid not null, "email" varchar(254) not null, "role" text check ("role" in ('crew', 'reviewer')) not null, "token_hash" varchar(64) not null, "invited_by_id" uuid not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "accepted_by_id" uuid null, "withdrawn_at" timestamptz null, "created_at" timestamptz not null default now(), constraint "invite_pkey" primary key ("id"));`);
    this.addSql(`alter table "invite" add constraint "invite_token_hash_unique" unique ("token_hash");`);

    this.addSql(`alter table "password_reset" add constraint "password_reset_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "membership" add constraint "membership_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "membership" add constraint "membership_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "invite" add constraint "invite_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invite" add constraint "invite_invited_by_id_foreign" foreign key ("invited_by_id") references "app_user" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invite" add constraint "invite_accepted_by_id_foreign" foreign key ("accepted_by_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`create index "membership_user_id_index" on "membership" ("user_id");`);
    this.addSql(`create index "invite_build_id_index" on "invite" ("build_id");`);

    // The session table of connect-pg-simple (its table.sql), kept here so the schema has one owner.
    this.addSql(`create table "session" ("sid" varchar not null collate "default", "sess" json not null, "expire" timestamp(6) not null, constraint "session_pkey" primary key ("sid"));`);
    this.addSql(`create index "session_expire_index" on "session" ("expire");`);
  }

}
