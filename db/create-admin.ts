// npm run admin:create -- --organization "Name" --email a@b.c --name "Full Name"
// Creates the first admin of a new installation, with its organisation. The password is read
// from ADMIN_PASSWORD or asked for on the terminal; nothing is written on invalid input.
import { createInterface } from "node:readline/promises";
import { parseArgs } from "node:util";
import { z } from "zod";
import { displayNameField, emailField, newPasswordField } from "../app/_lib/fields";
import { applyMigrations } from "./migrate";
import { ensureLocalDatabase } from "./local-postgres";

const input = z.object({
  organization: z.string().trim().min(2, "--organization: name the organisation (at least 2 characters)").max(120),
  email: emailField,
  name: displayNameField,
  password: newPasswordField,
});

async function main() {
  const { values } = parseArgs({ options: { organization: { type: "string" }, email: { type: "string" }, name: { type: "string" }, help: { type: "boolean" } } });
  if (values.help) {
    console.log('usage: npm run admin:create -- --organization "Name" --email admin@example.org --name "Full Name"\n(password from ADMIN_PASSWORD, or asked for)');
    return;
  }
  let password = process.env.ADMIN_PASSWORD;
  if (!password) {
    const rl = createInterface({ input: process.stdin, output: process.stdout });
    password = await rl.question("Password for the new admin (at least 10 characters): ");
    rl.close();
  }
  const parsed = input.safeParse({ ...values, password });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) console.error(`${issue.path.join(".")}: ${issue.message}`);
    process.exit(2);
  }
  const { url } = await ensureLocalDatabase();
  process.env.DATABASE_URL = url;
  await applyMigrations(url);
  const { createFirstAdmin } = await import("../app/_lib/accounts");
  await createFirstAdmin({ organization: parsed.data.organization, email: parsed.data.email, displayName: parsed.data.name, password: parsed.data.password });
  console.log(`admin ${parsed.data.email} created for "${parsed.data.organization}"; sign in at ${process.env.APP_URL ?? "http://127.0.0.1:3000"}/sign-in`);
  process.exit(0);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
