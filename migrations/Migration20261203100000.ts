// Each build's lists version (backend/src/http/list-cache.ts): the parts and receipts lists are answered from memory
// while the version is unchanged. Triggers mark a build (list_stale) on every write to a table its lists are read
// from; the next list read of a marked build clears the marks and moves the version on, in one statement.
import { Migration } from '@mikro-orm/migrations';

/**
 * Marks the builds of the rows a statement inserted, updated or deleted (`build` says how a row names its build).
 * With `changed`, only updated rows where it holds (n the new row, o the old) mark their build.
 */
function markingFunction(name: string, build: (row: string) => string, changed?: string): string {
  const updated = changed
    ? `select distinct ${build('n')} from new_rows n join old_rows o on o.id = n.id where ${changed}`
    : `select distinct ${build('t')} from new_rows t`;
  return `create function "${name}"() returns trigger language plpgsql as $$
begin
  if tg_op = 'INSERT' then
    insert into list_stale (build_id) select distinct ${build('t')} from new_rows t;
  elsif tg_op = 'DELETE' then
    insert into list_stale (build_id) select distinct ${build('t')} from old_rows t;
  else
    insert into list_stale (build_id) ${updated};
  end if;
  return null;
end $$;`;
}

const REFERENCING = { insert: 'new table as new_rows', update: 'old table as old_rows new table as new_rows', delete: 'old table as old_rows' };
const EVENTS = ['insert', 'update', 'delete'] as const;

/** Tables with the build's id on each row: every write to them can change a list. */
const BUILD_ROW_TABLES = ['part', 'vehicle_system', 'receipt', 'receipt_line', 'vendor', 'not_duplicate'];

export class Migration20261203100000 extends Migration {

  override async up(): Promise<void> {
    // Not unique: two transactions marking one build must not wait on each other's marks.
    this.addSql(`create table "list_stale" ("build_id" uuid not null);`);
    this.addSql(`create index "list_stale_build_id_index" on "list_stale" ("build_id");`);
    this.addSql(`create table "build_list_version" ("build_id" uuid not null, "version" bigint not null, constraint "build_list_version_pkey" primary key ("build_id"));`);
    this.addSql(`alter table "build_list_version" add constraint "build_list_version_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);

    this.addSql(markingFunction('list_stale_by_build_row', (row) => `${row}.build_id`));
    for (const table of BUILD_ROW_TABLES) {
      for (const event of EVENTS) {
        this.addSql(`create trigger "${table}_list_stale_${event}" after ${event} on "${table}" referencing ${REFERENCING[event]} for each statement execute function "list_stale_by_build_row"();`);
      }
    }
    // The build's own row: its currency sets the places of every figure in both lists.
    this.addSql(markingFunction('list_stale_by_build', (row) => `${row}.id`, 'n.currency <> o.currency'));
    this.addSql(`create trigger "build_list_stale_update" after update on "build" referencing ${REFERENCING.update} for each statement execute function "list_stale_by_build"();`);
    // A person's name is on the receipts they uploaded (members or former members): a new name marks those builds.
    this.addSql(`create function "list_stale_by_user"() returns trigger language plpgsql as $$
declare
  renamed uuid[] := array(select n.id from new_rows n join old_rows o on o.id = n.id where n.display_name is distinct from o.display_name);
begin
  if cardinality(renamed) > 0 then
    insert into list_stale (build_id) select distinct r.build_id from receipt r where r.uploaded_by_id = any(renamed);
  end if;
  return null;
end $$;`);
    this.addSql(`create trigger "app_user_list_stale_update" after update on "app_user" referencing ${REFERENCING.update} for each statement execute function "list_stale_by_user"();`);
  }

  override async down(): Promise<void> {
    for (const table of BUILD_ROW_TABLES) {
      for (const event of EVENTS) this.addSql(`drop trigger if exists "${table}_list_stale_${event}" on "${table}";`);
    }
    this.addSql(`drop trigger if exists "build_list_stale_update" on "build";`);
    this.addSql(`drop trigger if exists "app_user_list_stale_update" on "app_user";`);
    for (const fn of ['list_stale_by_build_row', 'list_stale_by_build', 'list_stale_by_user']) this.addSql(`drop function if exists "${fn}"();`);
    this.addSql(`drop table if exists "list_stale" cascade;`);
    this.addSql(`drop table if exists "build_list_version" cascade;`);
  }

}
