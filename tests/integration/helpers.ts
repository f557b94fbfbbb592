import { desc, sql as dsql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { caughtMail, users, type UserRole } from "@/db/schema";
import { newUserId } from "@/app/_lib/tokens";

/** Waits for a message to an address to reach the SMTP catcher (which stores it in PostgreSQL). */
export async function waitForMail(to: string, subjectIncludes: string, timeoutMs = 30_000) {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    const [mail] = await getDb()
      .select()
      .from(caughtMail)
      .where(dsql`${to.toLowerCase()} = any(${caughtMail.envelopeTo}) and ${caughtMail.subject} like ${"%" + subjectIncludes + "%"}`)
      .orderBy(desc(caughtMail.receivedAt))
      .limit(1);
    if (mail) return mail;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail "${subjectIncludes}" to ${to} within ${timeoutMs} ms`);
}

export function linkIn(text: string, path: string): { url: string; token: string } {
  const match = text.match(new RegExp(`https?://[^\\s]+${path}/([A-Za-z0-9_-]{43})`));
  if (!match) throw new Error(`no ${path} link in mail:\n${text}`);
  return { url: match[0], token: match[1] };
}

export const uniqueEmail = (prefix: string) => `${prefix}-${Date.now().toString(36)}${Math.floor(Math.random() * 1e6)}@test.example`;

/** The messages of a refused query (Drizzle wraps PostgreSQL's error as its cause); throws if it was accepted. */
export async function dbRefusal(query: PromiseLike<unknown>): Promise<string> {
  try {
    await query;
  } catch (err) {
    const messages: string[] = [];
    for (let e: unknown = err, depth = 0; e && depth < 4; e = (e as { cause?: unknown }).cause, depth++) messages.push(String((e as Error).message));
    return messages.join(" / ");
  }
  throw new Error("the database accepted the change");
}

/** A user of the organisation (a trainee unless said), with a unique test address. */
export async function makeUser<R extends UserRole = "trainee">(organizationId: string, name: string, passwordHash: string, role: R = "trainee" as R) {
  const id = newUserId();
  await getDb().insert(users).values({ id, organizationId, email: uniqueEmail(name.toLowerCase()), displayName: name, passwordHash, role });
  return { id, organizationId, role };
}
