// Account mail sent to each address in the last hour (auth/account-mail-cap.ts): the cap on sign-up and reset mail.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261203070000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "account_mail_sent" ("id" bigint generated always as identity primary key, "email" varchar(254) not null, "kind" text not null, "sent_at" timestamptz not null default now());`);
    this.addSql(`create index "account_mail_sent_email_index" on "account_mail_sent" ("email");`);
    this.addSql(`create index "account_mail_sent_sent_at_index" on "account_mail_sent" ("sent_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "account_mail_sent" cascade;`);
  }

}
