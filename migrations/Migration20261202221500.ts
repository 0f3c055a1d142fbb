// The warranty-ending alert: a choice per person (those who chose before get their role's default for it, on for
// owner and crew), and a kind of sent alert.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202221500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "alert_preference" add column "warranty_ending" boolean null;`);
    this.addSql(`update "alert_preference" a set "warranty_ending" = (m."role" in ('owner', 'crew')) from "membership" m where m."id" = a."membership_id";`);
    this.addSql(`alter table "alert_preference" alter column "warranty_ending" set not null;`);
    this.addSql(`alter table "alert_sent" drop constraint if exists "alert_sent_kind_check";`);
    this.addSql(`alter table "alert_sent" add constraint "alert_sent_kind_check" check("kind" in ('budget', 'coreDue', 'returnWindow', 'warrantyEnding', 'duplicate', 'reviewDigest'));`);
  }

  override async down(): Promise<void> {
    this.addSql(`delete from "alert_sent" where "kind" = 'warrantyEnding';`);
    this.addSql(`alter table "alert_sent" drop constraint if exists "alert_sent_kind_check";`);
    this.addSql(`alter table "alert_sent" add constraint "alert_sent_kind_check" check("kind" in ('budget', 'coreDue', 'returnWindow', 'duplicate', 'reviewDigest'));`);
    this.addSql(`alter table "alert_preference" drop column if exists "warranty_ending";`);
  }

}
