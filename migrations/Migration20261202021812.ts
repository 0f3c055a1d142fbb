// Vendors, receipts and their lines, core deposits and the audit trail.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202021812 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "audit_event" ("id" uuid not null, "build_id" uuid not null, "user_id" uuid not null, "receipt_id" uuid null, "entity" varchar(40) not null, "entity_id" uuid not null, "action" varchar(40) not null, "before" jsonb null, "after" jsonb null, "created_at" timestamptz not null default now(), constraint "audit_event_pkey" primary key ("id"));`);
    this.addSql(`create index "audit_event_build_id_created_at_index" on "audit_event" ("build_id", "created_at");`);
    this.addSql(`create index "audit_event_receipt_id_index" on "audit_event" ("receipt_id");`);

    this.addSql(`create table "vendor" ("id" uuid not null, "build_id" uuid not null, "name" varchar(120) not null, "normalized_name" varchar(120) not null, "created_at" timestamptz not null default now(), constraint "vendor_pkey" primary key ("id"));`);
    this.addSql(`alter table "vendor" add constraint "vendor_build_id_normalized_name_unique" unique ("build_id", "normalized_name");`);

    this.addSql(`create table "receipt" ("id" uuid not null, "build_id" uuid not null, "vendor_id" uuid null, "purchase_date" date null, "receipt_number" varchar(80) not null default '', "original_filename" varchar(255) not null, "document_key" varchar(400) not null, "content_type" varchar(80) not null, "sha256" varchar(64) not null, "size" int not null, "pages" int not null default 1, "page_images" jsonb not null default '[]', "state" text check ("state" in ('queued', 'reading', 'to_check', 'filed', 'failed')) not null default 'queued', "reading_progress" int not null default 0, "reading_error" text null, "extracted_text" text not null default '', "reading" jsonb null, "subtotal" numeric(19,4) null, "tax" numeric(19,4) null, "shipping" numeric(19,4) null, "discount" numeric(19,4) null, "total" numeric(19,4) null, "difference_accepted" boolean not null default false, "difference_reason" text not null default '', "uploaded_by_id" uuid not null, "review_state" text check ("review_state" in ('none', 'approved', 'questioned')) not null default 'none', "review_comment" text not null default '', "reviewed_by_id" uuid null, "reviewed_at" timestamptz null, "filed_at" timestamptz null, "filed_by_id" uuid null, "version" int not null default 1, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "receipt_pkey" primary key ("id"));`);
    this.addSql(`create index "receipt_build_id_state_index" on "receipt" ("build_id", "state");`);
    this.addSql(`create index "receipt_build_id_sha256_index" on "receipt" ("build_id", "sha256");`);
    this.addSql(`create index "receipt_build_id_purchase_date_index" on "receipt" ("build_id", "purchase_date");`);

    this.addSql(`create table "receipt_line" ("id" uuid not null, "build_id" uuid not null, "receipt_id" uuid not null, "position" int not null default 0, "kind" text check ("kind" in ('part', 'return', 'core_charge', 'core_refund', 'fee', 'discount')) not null, "description" varchar(300) not null, "part_number" varchar(80) not null default '', "quantity" numeric(19,4) not null default '1', "unit_price" numeric(19,4) null, "amount" numeric(19,4) not null, "taxable" boolean not null default true, "allocated_tax" numeric(19,4) not null default '0', "allocated_shipping" numeric(19,4) not null default '0', "allocated_discount" numeric(19,4) not null default '0', "part_id" uuid null, "system_id" uuid null, "return_of_id" uuid null, "box" jsonb null, "confidence" jsonb not null default '{}', "version" int not null default 1, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "receipt_line_pkey" primary key ("id"));`);
    this.addSql(`create index "receipt_line_receipt_id_position_index" on "receipt_line" ("receipt_id", "position");`);
    this.addSql(`create index "receipt_line_build_id_system_id_index" on "receipt_line" ("build_id", "system_id");`);
    this.addSql(`create index "receipt_line_build_id_part_id_index" on "receipt_line" ("build_id", "part_id");`);

    this.addSql(`create table "core" ("id" uuid not null, "build_id" uuid not null, "charge_line_id" uuid not null, "state" text check ("state" in ('owed', 'dropped_off', 'refunded', 'forfeited')) not null default 'owed', "due_date" date not null, "refund_line_id" uuid null, "version" int not null default 1, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "core_pkey" primary key ("id"));`);
    this.addSql(`alter table "core" add constraint "core_charge_line_id_unique" unique ("charge_line_id");`);
    this.addSql(`create index "core_build_id_state_index" on "core" ("build_id", "state");`);

    this.addSql(`alter table "audit_event" add constraint "audit_event_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "audit_event" add constraint "audit_event_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete restrict;`);

    this.addSql(`alter table "vendor" add constraint "vendor_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "receipt" add constraint "receipt_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "receipt" add constraint "receipt_vendor_id_foreign" foreign key ("vendor_id") references "vendor" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "receipt" add constraint "receipt_uploaded_by_id_foreign" foreign key ("uploaded_by_id") references "app_user" ("id") on update cascade on delete restrict;`);
    this.addSql(`alter table "receipt" add constraint "receipt_reviewed_by_id_foreign" foreign key ("reviewed_by_id") references "app_user" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "receipt" add constraint "receipt_filed_by_id_foreign" foreign key ("filed_by_id") references "app_user" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "receipt_line" add constraint "receipt_line_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "receipt_line" add constraint "receipt_line_receipt_id_foreign" foreign key ("receipt_id") references "receipt" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "receipt_line" add constraint "receipt_line_part_id_foreign" foreign key ("part_id") references "part" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "receipt_line" add constraint "receipt_line_system_id_foreign" foreign key ("system_id") references "vehicle_system" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "receipt_line" add constraint "receipt_line_return_of_id_foreign" foreign key ("return_of_id") references "receipt_line" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "core" add constraint "core_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "core" add constraint "core_charge_line_id_foreign" foreign key ("charge_line_id") references "receipt_line" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "core" add constraint "core_refund_line_id_foreign" foreign key ("refund_line_id") references "receipt_line" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "receipt" drop constraint "receipt_vendor_id_foreign";`);

    this.addSql(`alter table "receipt_line" drop constraint "receipt_line_receipt_id_foreign";`);

    this.addSql(`alter table "receipt_line" drop constraint "receipt_line_return_of_id_foreign";`);

    this.addSql(`alter table "core" drop constraint "core_charge_line_id_foreign";`);

    this.addSql(`alter table "core" drop constraint "core_refund_line_id_foreign";`);

    this.addSql(`drop table if exists "audit_event" cascade;`);

    this.addSql(`drop table if exists "vendor" cascade;`);

    this.addSql(`drop table if exists "receipt" cascade;`);

    this.addSql(`drop table if exists "receipt_line" cascade;`);

    this.addSql(`drop table if exists "core" cascade;`);
  }

}
