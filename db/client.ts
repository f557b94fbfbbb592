import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";

// One pool per server process; DATABASE_URL is provided by the start command (or by the operator).
function createDb() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: start the app with `npm start`, or set it in the environment.");
  const sql = postgres(url, { max: Number(process.env.DATABASE_POOL_SIZE ?? 10), onnotice: () => {} });
  return drizzle(sql, { schema });
}

type Db = ReturnType<typeof createDb>;
const globalForDb = globalThis as unknown as { loopwrightDb?: Db };

export function getDb(): Db {
  globalForDb.loopwrightDb ??= createDb();
  return globalForDb.loopwrightDb;
}

export type Database = Db;
export type Transaction = Parameters<Parameters<Db["transaction"]>[0]>[0];
