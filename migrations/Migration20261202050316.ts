// Mail alerts: per-member preferences, the record of alerts sent (unique per person, kind and event), a build's return window.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202050316 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "alert_preference" ("id" uuid not null, "membership_id" uuid not null, "budget" boolean not null, "core_due" boolean not null, "return_window" boolean not null, "duplicate" boolean not null, "review_digest" boolean not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), constraint "alert_preference_pkey" primary key ("id"));`);
    this.addSql(`alter table "alert_preference" add constraint "alert_preference_membership_id_unique" unique ("membership_id");`);

    this.addSql(`create table "alert_sent" ("id" uuid not null, "user_id" uuid not null, "build_id" uuid not null, "kind" text check ("kind" in ('budget', 'coreDue', 'returnWindow', 'duplicate', 'reviewDigest')) not null, "event_key" text not null, "sent_at" timestamptz not null default now(), constraint "alert_sent_pkey" primary key ("id"));`);
    this.addSql(`create index "alert_sent_build_id_kind_index" on "alert_sent" ("build_id", "kind");`);
    this.addSql(`alter table "alert_sent" add constraint "alert_sent_user_kind_event_key_unique" unique ("user_id", "kind", "event_key");`);

    this.addSql(`alter table "alert_preference" add constraint "alert_preference_membership_id_foreign" foreign key ("membership_id") references "membership" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "alert_sent" add constraint "alert_sent_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "alert_sent" add constraint "alert_sent_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "build" add column "return_window_days" int not null default 30;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "alert_preference" cascade;`);

    this.addSql(`drop table if exists "alert_sent" cascade;`);

    this.addSql(`alter table "build" drop column "return_window_days";`);
  }

}
