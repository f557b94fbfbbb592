// Failed sign-ins are limited per account and per client address, with the counters in
// PostgreSQL so every app server sees the same numbers.
import { inArray, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { signInAttempts } from "@/db/schema";

export const SIGN_IN_LIMITS = {
  windowMinutes: 15,
  lockMinutes: 15,
  perAccount: 5,
  perAddress: 30,
} as const;

export const accountKey = (email: string) => `account:${email.trim().toLowerCase()}`;
/** Password-reset requests per client address, in the same counters (a window and a lock). */
export const resetRequestKey = (address: string) => `reset:${address}`;
export const RESET_REQUEST_LIMIT = 10;
export const addressKey = (address: string) => `address:${address}`;

/** Minutes until the first of these keys unlocks, or 0 when none is locked. */
export async function lockedMinutes(keys: string[]): Promise<number> {
  const rows = await getDb().select().from(signInAttempts).where(inArray(signInAttempts.key, keys));
  const now = Date.now();
  const until = Math.max(0, ...rows.map((r) => (r.lockedUntil ? r.lockedUntil.getTime() - now : 0)));
  return until > 0 ? Math.ceil(until / 60_000) : 0;
}

/** Counts one failure against a key; locks it when its limit is reached inside the window. */
export async function recordFailure(key: string, limit: number): Promise<void> {
  const { windowMinutes, lockMinutes } = SIGN_IN_LIMITS;
  await getDb().execute(sql`
    insert into sign_in_attempts as a (key, failures, window_started_at)
    values (${key}, 1, now())
    on conflict (key) do update set
      failures = case when a.window_started_at < now() - make_interval(mins => ${windowMinutes}) then 1 else a.failures + 1 end,
      window_started_at = case when a.window_started_at < now() - make_interval(mins => ${windowMinutes}) then now() else a.window_started_at end`);
  await getDb().execute(sql`
    update sign_in_attempts set locked_until = now() + make_interval(mins => ${lockMinutes}), failures = 0, window_started_at = now()
    where key = ${key} and failures >= ${limit}`);
}

export async function clearFailures(key: string): Promise<void> {
  await getDb().delete(signInAttempts).where(inArray(signInAttempts.key, [key]));
}
