// Systems with budgets, the build's contingency, and the parts of the bill of materials.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202020838 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "vehicle_system" ("id" uuid not null, "build_id" uuid not null, "name" varchar(80) not null, "budget" numeric(19,4) not null default '0', "sort_order" int not null default 0, "archived_at" timestamptz null, "version" int not null default 1, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "vehicle_system_pkey" primary key ("id"));`);
    this.addSql(`create index "vehicle_system_build_id_sort_order_index" on "vehicle_system" ("build_id", "sort_order");`);

    this.addSql(`create table "part" ("id" uuid not null, "build_id" uuid not null, "system_id" uuid not null, "description" varchar(200) not null, "part_number" varchar(80) not null default '', "quantity" numeric(19,4) not null, "unit" text check ("unit" in ('each', 'pair', 'set', 'ft', 'm', 'qt', 'L', 'gal')) not null, "estimated_unit_cost" numeric(19,4) not null, "status" text check ("status" in ('planned', 'ordered', 'on_hand', 'installed', 'returned', 'sold')) not null default 'planned', "storage_location" varchar(120) not null default '', "source_url" varchar(2000) not null default '', "notes" text not null default '', "for_sale" boolean not null default false, "asking_price" numeric(19,4) null, "version" int not null default 1, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "part_pkey" primary key ("id"));`);
    this.addSql(`create index "part_build_id_system_id_index" on "part" ("build_id", "system_id");`);
    this.addSql(`create index "part_build_id_status_index" on "part" ("build_id", "status");`);

    this.addSql(`alter table "vehicle_system" add constraint "vehicle_system_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "part" add constraint "part_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "part" add constraint "part_system_id_foreign" foreign key ("system_id") references "vehicle_system" ("id") on update cascade on delete restrict;`);

    this.addSql(`alter table "build" add column "contingency_budget" numeric(19,4) not null default '0';`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "part" drop constraint "part_system_id_foreign";`);

    this.addSql(`drop table if exists "vehicle_system" cascade;`);

    this.addSql(`drop table if exists "part" cascade;`);

    this.addSql(`alter table "build" drop column "contingency_budget";`);
  }

}
