// "Nothing changed" as a number per table: an md5 over the text of every row that belongs to the
// matrix. A row belongs to it when its text contains the marker "access-matrix" (all fixture
// names, e-mail addresses and user ids carry it) or one of the fixture ids (organisation, cohorts,
// plants, run, tuning set). Scoping to the matrix's rows keeps the digest still while other test
// files (and the browser tests, when the whole suite runs) write in the same database; a refused
// call that wrote anything about the fixtures changes it. Every table of the public schema is
// included, so tables added later are covered without a change here, except caught_mail, which
// the SMTP catcher fills asynchronously after an allowed call has sent mail.
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";

const EXCLUDED = new Set(["caught_mail"]);

export type Digest = Record<string, string>;

let tables: string[] | null = null;

async function publicTables(): Promise<string[]> {
  const rows = (await getDb().execute(
    sql`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name`,
  )) as unknown as { table_name: string }[];
  return rows.map((r) => r.table_name).filter((t) => !EXCLUDED.has(t));
}

const escapeRegex = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

export async function digest(marker: string, ids: readonly string[]): Promise<Digest> {
  tables ??= await publicTables();
  const pattern = [marker, ...ids].map(escapeRegex).join("|");
  const parts = tables.map(
    (t) => sql`select ${t}::text as t, count(*)::int as n, md5(coalesce(string_agg(x::text, '|' order by x::text), '')) as h from ${sql.identifier(t)} x where x::text ~* ${pattern}`,
  );
  const rows = (await getDb().execute(sql.join(parts, sql` union all `))) as unknown as { t: string; n: number; h: string }[];
  return Object.fromEntries(rows.map((r) => [r.t, `${r.n}:${r.h}`]));
}

/** The tables whose digest differs. */
export function changedTables(before: Digest, after: Digest): string[] {
  return Object.keys({ ...before, ...after }).filter((t) => before[t] !== after[t]);
}
