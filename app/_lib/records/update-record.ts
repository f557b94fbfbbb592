// Changes to a tuning record: its author edits the title and notes until signing it off, and
// signs it off once. After that the row is frozen — here, and by the database trigger of
// migration 0005, whose refusal is answered with the same clear message.
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { getDb, type Transaction } from "@/db/client";
import { tuningRecords } from "@/db/schema";
import { ActionRefused } from "@/app/_lib/action";
import { firstIssue, isUuid, type BenchUser } from "@/app/_lib/bench-store";

const recordId = z.string().refine(isUuid, "That record does not exist.");

export const recordNotesSchema = z.object({
  recordId,
  title: z.string().trim().min(1, "Give the record a title.").max(160, "Keep the title under 160 characters."),
  notes: z.string().trim().max(8000, "Keep the notes under 8000 characters.").default(""),
});
export type RecordNotesInput = z.input<typeof recordNotesSchema>;

const isoDate = /^(\d{4})-(\d{2})-(\d{2})$/;
const isCalendarDate = (s: string) => {
  const m = isoDate.exec(s);
  if (!m) return false;
  const d = new Date(Date.UTC(+m[1], +m[2] - 1, +m[3]));
  return d.getUTCFullYear() === +m[1] && d.getUTCMonth() === +m[2] - 1 && d.getUTCDate() === +m[3];
};

export const signOffSchema = z.object({
  recordId,
  name: z.string().trim().min(1, "Write the name of the person signing off.").max(120, "Keep the name under 120 characters."),
  date: z.string().trim().refine(isCalendarDate, "Write the date as yyyy-mm-dd (for example 2026-03-14)."),
});
export type SignOffInput = z.input<typeof signOffSchema>;

const HOUR_MS = 3600_000;
const utcDate = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** The sign-off date is the signer's local date: any date some time zone (UTC−12 … UTC+14) may have. */
export function signOffDateProblem(date: string, createdAt: Date, now = new Date()): string | null {
  if (date > utcDate(now.getTime() + 14 * HOUR_MS)) return "The sign-off date is in the future.";
  if (date < utcDate(createdAt.getTime() - 12 * HOUR_MS)) return `The sign-off date is before the record was written (${utcDate(createdAt.getTime())}).`;
  return null;
}

export const FROZEN_MESSAGE = "This record is signed off: it is frozen and cannot be changed.";

/** The database trigger's refusal (check_violation from tuning_records_refuse_after_signoff). */
function isFrozenRefusal(err: unknown): boolean {
  for (let e: unknown = err, depth = 0; e && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    if ((e as { code?: unknown }).code === "23514" && /signed-off tuning record/.test(String((e as Error).message))) return true;
  }
  return false;
}

function validated<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const r = schema.safeParse(input);
  if (!r.success) throw new ActionRefused(firstIssue(r.error));
  return r.data;
}

/** The user's own, unsigned record, locked for the change. Foreign and missing records get the same answer. */
async function ownOpenRecord(tx: Transaction, user: BenchUser, id: string) {
  const [row] = await tx
    .select({ id: tuningRecords.id, ownerId: tuningRecords.ownerId, signedOffBy: tuningRecords.signedOffBy, createdAt: tuningRecords.createdAt })
    .from(tuningRecords)
    .where(and(eq(tuningRecords.id, id), eq(tuningRecords.organizationId, user.organizationId)))
    .for("update");
  if (!row) throw new ActionRefused("That record does not exist.");
  if (row.ownerId !== user.id) throw new ActionRefused("Only the author of this record can change it.");
  if (row.signedOffBy !== null) throw new ActionRefused(FROZEN_MESSAGE);
  return row;
}

async function frozenAware<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (isFrozenRefusal(err)) throw new ActionRefused(FROZEN_MESSAGE);
    throw err;
  }
}

export async function updateRecordNotes(user: BenchUser, input: RecordNotesInput): Promise<void> {
  const p = validated(recordNotesSchema, input);
  await frozenAware(() =>
    getDb().transaction(async (tx) => {
      await ownOpenRecord(tx, user, p.recordId);
      await tx.update(tuningRecords).set({ title: p.title, notes: p.notes, updatedAt: new Date() }).where(eq(tuningRecords.id, p.recordId));
    }),
  );
}

export async function signOffRecord(user: BenchUser, input: SignOffInput, now = new Date()): Promise<void> {
  const p = validated(signOffSchema, input);
  await frozenAware(() =>
    getDb().transaction(async (tx) => {
      const row = await ownOpenRecord(tx, user, p.recordId);
      const problem = signOffDateProblem(p.date, row.createdAt, now);
      if (problem) throw new ActionRefused(problem);
      await tx
        .update(tuningRecords)
        .set({ signedOffBy: p.name, signedOffOn: p.date, signedOffAt: now, updatedAt: now })
        .where(eq(tuningRecords.id, p.recordId));
    }),
  );
}
