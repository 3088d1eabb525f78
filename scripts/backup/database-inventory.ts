import type pg from 'pg';

/**
 * What a backup promises about the database: every table's row count and the applied migrations.
 * The same queries run before the dump (inside the dump's snapshot) and after a restore.
 */
export interface TableRef {
  schema: string;
  name: string;
  /** A partitioned table's count includes its partitions' rows, which are listed (and counted) too. */
  partitioned: boolean;
}

// Tables that belong to an extension are recreated by CREATE EXTENSION, not dumped as data.
// Partitioned tables (pg-boss's job table) are listed with their partitions.
const TABLES_SQL = `
  select n.nspname as schema, c.relname as name, c.relkind = 'p' as partitioned
  from pg_class c
  join pg_namespace n on n.oid = c.relnamespace
  where c.relkind in ('r', 'p')
    and n.nspname not in ('pg_catalog', 'information_schema')
    and n.nspname not like 'pg\\_toast%' and n.nspname not like 'pg\\_temp%'
    and not exists (select 1 from pg_depend d where d.classid = 'pg_class'::regclass and d.objid = c.oid and d.deptype = 'e')
  order by 1, 2`;

export function quoteIdent(name: string): string {
  return `"${name.replace(/"/g, '""')}"`;
}

export function tableKey(table: TableRef): string {
  return `${table.schema}.${table.name}`;
}

export async function listTables(client: pg.ClientBase): Promise<TableRef[]> {
  return (await client.query<TableRef>(TABLES_SQL)).rows;
}

/** Row count of every table, keyed "schema.table", in the order of the table list. */
export async function countRows(client: pg.ClientBase, tables: readonly TableRef[]): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const { rows } = await client.query<{ n: string }>(`select count(*) as n from ${quoteIdent(table.schema)}.${quoteIdent(table.name)}`);
    counts[tableKey(table)] = Number(rows[0]!.n);
  }
  return counts;
}

/** Applied Kysely migrations, oldest first; null when the database has no Trenchwork schema. */
export async function listMigrations(client: pg.ClientBase): Promise<string[] | null> {
  const { rows } = await client.query<{ present: boolean }>(`select to_regclass('public.kysely_migration') is not null as present`);
  if (!rows[0]!.present) return null;
  return (await client.query<{ name: string }>('select name from public.kysely_migration order by name')).rows.map((r) => r.name);
}

/** Rows stored, each counted once (a partitioned table's rows sit in its partitions). */
export function totalRows(tables: readonly TableRef[], counts: Record<string, number>): number {
  return tables.filter((t) => !t.partitioned).reduce((sum, t) => sum + (counts[tableKey(t)] ?? 0), 0);
}

export async function serverVersion(client: pg.ClientBase): Promise<string> {
  return (await client.query<{ v: string }>("select current_setting('server_version') as v")).rows[0]!.v;
}
