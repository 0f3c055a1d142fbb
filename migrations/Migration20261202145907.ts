// Upload keys: one row per (build, person, Idempotency-Key), so a repeated capture answers the receipts it already made.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202145907 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "upload_key" ("id" uuid not null, "build_id" uuid not null, "user_id" uuid not null, "key" varchar(255) not null, "content_sha256" varchar(64) not null, "receipt_ids" jsonb not null default '[]', "created_at" timestamptz not null default now(), constraint "upload_key_pkey" primary key ("id"));`);
    this.addSql(`alter table "upload_key" add constraint "upload_key_build_user_key_unique" unique ("build_id", "user_id", "key");`);

    this.addSql(`alter table "upload_key" add constraint "upload_key_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "upload_key" add constraint "upload_key_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "upload_key" cascade;`);
  }

}
