// Sign-ups waiting for their e-mailed link (auth/pending-sign-up.entity.ts).
import { Migration } from '@mikro-orm/migrations';

export class Migration20261203034146 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "pending_sign_up" ("id" uuid not null, "email" varchar(254) not null, "display_name" varchar(80) not null, "password_hash" text not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "created_at" timestamptz not null default now(), constraint "pending_sign_up_pkey" primary key ("id"));`);
    this.addSql(`alter table "pending_sign_up" add constraint "pending_sign_up_token_hash_unique" unique ("token_hash");`);
    this.addSql(`create index "pending_sign_up_email_index" on "pending_sign_up" ("email");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "pending_sign_up" cascade;`);
  }

}
