// A part's warranty: a length in whole months or lifetime (never both), the day it starts, and the receipt it rests on.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202220000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "part" add column "warranty_months" int null, add column "warranty_lifetime" boolean not null default false, add column "warranty_start" date null, add column "warranty_receipt_id" uuid null;`);
    // 1200 months (a hundred years) is far past any printed warranty; longer is a typing slip.
    this.addSql(`alter table "part" add constraint "part_warranty_months_range" check ("warranty_months" between 1 and 1200);`);
    this.addSql(`alter table "part" add constraint "part_warranty_one_length" check (not ("warranty_lifetime" and "warranty_months" is not null));`);
    // A length in months needs its start to have an end; a start or receipt without any warranty means nothing.
    this.addSql(`alter table "part" add constraint "part_warranty_months_start" check ("warranty_months" is null or "warranty_start" is not null);`);
    this.addSql(`alter table "part" add constraint "part_warranty_details_need_length" check ("warranty_lifetime" or "warranty_months" is not null or ("warranty_start" is null and "warranty_receipt_id" is null));`);
    this.addSql(`alter table "part" add constraint "part_warranty_receipt_id_foreign" foreign key ("warranty_receipt_id") references "receipt" ("id") on update cascade on delete set null;`);
    this.addSql(`create index "part_warranty_receipt_id_index" on "part" ("warranty_receipt_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "part" drop constraint if exists "part_warranty_receipt_id_foreign";`);
    this.addSql(`alter table "part" drop column if exists "warranty_receipt_id", drop column if exists "warranty_start", drop column if exists "warranty_lifetime", drop column if exists "warranty_months";`);
  }

}
