// The ledger's running totals: per system, the sums the ledger reads from filed receipt lines; per part, what its filed
// purchase lines cost (the overrun factor). Triggers mark a build stale whenever a write can change those sums; the
// app recomputes a marked build's totals before its transaction commits (backend/src/ledger/ledger-totals.ts).
import { Migration } from '@mikro-orm/migrations';

/**
 * Each trigger function adds the builds its statement touched to ledger_stale. `counted` says which inserted or deleted
 * rows (alias t) can change a sum; `changed` which updated rows can (n the new row, o the old).
 */
function markingFunction(name: string, counted: string, changed: string): string {
  return `create function "${name}"() returns trigger language plpgsql as $$
begin
  if tg_op = 'INSERT' then
    insert into ledger_stale (build_id) select distinct t.build_id from new_rows t where ${counted};
  elsif tg_op = 'DELETE' then
    insert into ledger_stale (build_id) select distinct t.build_id from old_rows t where ${counted};
  else
    insert into ledger_stale (build_id) select distinct n.build_id from new_rows n join old_rows o on o.id = n.id where ${changed};
  end if;
  return null;
end $$;`;
}

/** A statement trigger that reads transition tables names one event and no columns: one trigger per event. */
function triggers(table: string, fn: string, events: ('insert' | 'update' | 'delete')[]): string[] {
  const referencing = { insert: 'new table as new_rows', update: 'old table as old_rows new table as new_rows', delete: 'old table as old_rows' };
  return events.map(
    (event) => `create trigger "${table}_ledger_stale_${event}" after ${event} on "${table}" referencing ${referencing[event]} for each statement execute function "${fn}"();`,
  );
}

const ON_FILED_RECEIPT = (line: string) => `exists (select 1 from receipt r where r.id = ${line}.receipt_id and r.state = 'filed')`;

export class Migration20261203040000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "ledger_system_total" ("system_id" uuid not null, "build_id" uuid not null, "spent" numeric(19,4) not null, "net_cost" numeric(19,4) not null, "cores_outstanding" numeric(19,4) not null, "returns_awaiting" numeric(19,4) not null, constraint "ledger_system_total_pkey" primary key ("system_id"));`);
    this.addSql(`create index "ledger_system_total_build_id_index" on "ledger_system_total" ("build_id");`);
    this.addSql(`create table "ledger_part_total" ("part_id" uuid not null, "build_id" uuid not null, "actual" numeric(19,4) not null, constraint "ledger_part_total_pkey" primary key ("part_id"));`);
    this.addSql(`create index "ledger_part_total_build_id_index" on "ledger_part_total" ("build_id");`);
    // Only the build is a foreign key: a key on the system or the part would make a recompute wait on a row another
    // transaction deletes while that one waits on the build's lock. A recompute drops a deleted one's row itself.
    this.addSql(`alter table "ledger_system_total" add constraint "ledger_system_total_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "ledger_part_total" add constraint "ledger_part_total_build_id_foreign" foreign key ("build_id") references "build" ("id") on update cascade on delete cascade;`);
    // Not unique: two transactions marking one build must not wait on each other's marks. tx says whose mark it is.
    this.addSql(`create table "ledger_stale" ("build_id" uuid not null, "tx" bigint not null default txid_current());`);
    this.addSql(`create index "ledger_stale_build_id_index" on "ledger_stale" ("build_id");`);
    this.addSql(`create index "ledger_stale_tx_index" on "ledger_stale" ("tx");`);

    // Lines count only on filed receipts; filing, reopening and deleting a filed receipt move its state across 'filed'.
    this.addSql(markingFunction('ledger_stale_by_line', ON_FILED_RECEIPT('t'), ON_FILED_RECEIPT('n')));
    this.addSql(markingFunction('ledger_stale_by_receipt', `t.state = 'filed'`, `(n.state = 'filed') <> (o.state = 'filed')`));
    this.addSql(markingFunction('ledger_stale_by_core', 'true', 'n.state <> o.state or n.charge_line_id <> o.charge_line_id'));
    // A part's status says whether it was sent back (returns awaiting refund); deleting it unlinks its lines (marked above).
    this.addSql(markingFunction('ledger_stale_by_part', 'false', `(n.status = 'returned') <> (o.status = 'returned')`));
    for (const sql of triggers('receipt_line', 'ledger_stale_by_line', ['insert', 'update', 'delete'])) this.addSql(sql);
    for (const sql of triggers('receipt', 'ledger_stale_by_receipt', ['insert', 'update', 'delete'])) this.addSql(sql);
    for (const sql of triggers('core', 'ledger_stale_by_core', ['insert', 'update', 'delete'])) this.addSql(sql);
    for (const sql of triggers('part', 'ledger_stale_by_part', ['update'])) this.addSql(sql);

    // Every build with filed receipts is marked: `npm run migrate` then computes their totals with the app's own
    // function, and a build still marked is brought up to date at its next ledger read.
    this.addSql(`insert into "ledger_stale" ("build_id") select distinct "build_id" from "receipt" where "state" = 'filed';`);
  }

  override async down(): Promise<void> {
    for (const table of ['receipt_line', 'receipt', 'core', 'part']) {
      for (const event of ['insert', 'update', 'delete']) this.addSql(`drop trigger if exists "${table}_ledger_stale_${event}" on "${table}";`);
    }
    for (const fn of ['ledger_stale_by_line', 'ledger_stale_by_receipt', 'ledger_stale_by_core', 'ledger_stale_by_part']) this.addSql(`drop function if exists "${fn}"();`);
    this.addSql(`drop table if exists "ledger_stale" cascade;`);
    this.addSql(`drop table if exists "ledger_part_total" cascade;`);
    this.addSql(`drop table if exists "ledger_system_total" cascade;`);
  }

}
