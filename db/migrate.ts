import path from "node:path";
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";

/** Applies the committed SQL migrations in migrations/ (idempotent: drizzle records what ran). */
export async function applyMigrations(url: string): Promise<void> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    await migrate(drizzle(sql), { migrationsFolder: path.resolve(process.env.LOOPWRIGHT_ROOT ?? process.cwd(), "migrations") });
  } finally {
    await sql.end();
  }
}
