// Comments on receipts, for review.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202035558 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "comment" ("id" uuid not null, "build_id" uuid not null, "receipt_id" uuid not null, "author_id" uuid not null, "body" text not null, "created_at" timestamptz not null default now(), constraint "comment_pkey" primary key ("id"));`);
    this.addSql(`create index "comment_receipt_id_created_at_index" on "comment" ("receipt_id", "created_at");`);

    this.addSql(`alter table "comment" add constraint "comment_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "comment" add constraint "comment_receipt_id_foreign" foreign key ("receipt_id") references "receipt" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "comment" add constraint "comment_author_id_foreign" foreign key ("author_id") references "app_user" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "comment" cascade;`);
  }

}
