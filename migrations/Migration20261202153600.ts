// The review loop: a questioned receipt can be "answered", and pairs of receipts marked "not a duplicate" (stored in id
// order, so a pair is one row whichever receipt it was marked from).
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202153600 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "receipt" drop constraint if exists "receipt_review_state_check";`);
    this.addSql(`alter table "receipt" add constraint "receipt_review_state_check" check("review_state" in ('none', 'approved', 'questioned', 'answered'));`);

    this.addSql(`create table "not_duplicate" ("id" uuid not null, "build_id" uuid not null, "first_id" uuid not null, "second_id" uuid not null, "marked_by_id" uuid not null, "reason" text not null, "created_at" timestamptz not null default now(), constraint "not_duplicate_pkey" primary key ("id"), constraint "not_duplicate_pair_in_order" check ("first_id" < "second_id"));`);
    this.addSql(`create index "not_duplicate_second_id_index" on "not_duplicate" ("second_id");`);
    this.addSql(`alter table "not_duplicate" add constraint "not_duplicate_first_id_second_id_unique" unique ("first_id", "second_id");`);

    this.addSql(`alter table "not_duplicate" add constraint "not_duplicate_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "not_duplicate" add constraint "not_duplicate_first_id_foreign" foreign key ("first_id") references "receipt" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "not_duplicate" add constraint "not_duplicate_second_id_foreign" foreign key ("second_id") references "receipt" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "not_duplicate" add constraint "not_duplicate_marked_by_id_foreign" foreign key ("marked_by_id") references "app_user" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "not_duplicate" cascade;`);
    this.addSql(`update "receipt" set "review_state" = 'questioned' where "review_state" = 'answered';`);
    this.addSql(`alter table "receipt" drop constraint if exists "receipt_review_state_check";`);
    this.addSql(`alter table "receipt" add constraint "receipt_review_state_check" check("review_state" in ('none', 'approved', 'questioned'));`);
  }

}
