import { defineConfig } from "drizzle-kit";

// Migrations are generated offline from db/schema.ts (`npm run db:generate`) and applied by the
// start and test commands (db/migrate.ts); DATABASE_URL is only needed for drizzle-kit's online commands.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./migrations",
  dbCredentials: { url: process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:5432/loopwright" },
  strict: true,
});
