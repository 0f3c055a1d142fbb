// Line suggestions: pg_trgm (shipped with PostgreSQL; trusted, so the database's owner may create it) with trigram
// indexes on part names and line descriptions, and indexes on the compared form of part numbers.
import { Migration } from '@mikro-orm/migrations';

export class Migration20261202150000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create extension if not exists pg_trgm;`);
    this.addSql(`create index "part_description_trgm" on "part" using gin ("description" gin_trgm_ops);`);
    this.addSql(`create index "receipt_line_description_trgm" on "receipt_line" using gin ("description" gin_trgm_ops);`);
    this.addSql(`create index "part_part_number_key" on "part" ("build_id", (regexp_replace(lower("part_number"), '[^a-z0-9]+', '', 'g')));`);
    this.addSql(`create index "receipt_line_part_number_key" on "receipt_line" ("build_id", (regexp_replace(lower("part_number"), '[^a-z0-9]+', '', 'g')));`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop index if exists "receipt_line_part_number_key";`);
    this.addSql(`drop index if exists "part_part_number_key";`);
    this.addSql(`drop index if exists "receipt_line_description_trgm";`);
    this.addSql(`drop index if exists "part_description_trgm";`);
  }

}
