// The Bench's saved work, independent of Next: plants, tuning sets and saved runs, with their
// rules. Server actions (app/(app)/bench/actions.ts) call these after the guard has established
// the signed-in user; integration tests call them directly against a real database.
//
// Rules:
// - every row belongs to its owner and the owner's organisation; only the owner changes or
//   deletes it;
// - a plant marked shared is readable by every signed-in user of the same organisation, never
//   outside it; the engine's presets are readable by all;
// - tuning sets and saved runs name their plant by reference ("preset:<id>" | "plant:<uuid>"),
//   and may only be written for a plant the user can read;
// - documents are validated with the engine's own zod schemas before anything is written, and
//   each change is one transaction: bad input writes nothing.
import { and, eq, inArray, or } from "drizzle-orm";
import { z } from "zod";
import { getDb, type Transaction } from "@/db/client";
import { plants, savedRuns, tuningSets } from "@/db/schema";
import { controllerConfigSchema } from "@/sim/control/config";
import { actionLogSchema } from "@/sim/drill/actions";
import { drillSchema } from "@/sim/drill/schema";
import { plantDefinitionSchema } from "@/sim/plant/plant-definition";
import { findPreset } from "@/sim/plant/presets";
import { ActionRefused } from "./action";
import { parsePlantRef, uuidPattern } from "./plant-ref";

/** Who is acting: the signed-in user (SignedInUser satisfies this). */
export interface BenchUser {
  id: string;
  organizationId: string;
}

// ---- plant references ----

export { parsePlantRef, type PlantRef } from "./plant-ref";

export const presetRef = (presetId: string) => `preset:${presetId}`;
export const plantRefOf = (plantId: string) => `plant:${plantId}`;

export const plantRefField = z
  .string()
  .max(200)
  .refine((r) => parsePlantRef(r) !== null, "Choose a plant (a preset or one of your plants).");

export const isUuid = (s: string) => uuidPattern.test(s);

// ---- input schemas (shared with the server actions) ----

/** "a.b.0.c: message" — the first issue of a zod error, with where it is. */
export function firstIssue(error: z.ZodError, prefix?: string): string {
  const issue = error.issues[0];
  if (!issue) return "Check the input.";
  const path = [prefix, ...issue.path.map(String)].filter(Boolean).join(".");
  return path ? `${path}: ${issue.message}` : issue.message;
}

/** A nested document validated by an engine schema, reported as one clear issue with its path. */
function engineDocument<S extends z.ZodType>(schema: S, what: string) {
  return z.unknown().transform((value, ctx): z.output<S> => {
    const r = schema.safeParse(value);
    if (!r.success) {
      ctx.addIssue({ code: "custom", message: `The ${what} is not valid — ${firstIssue(r.error)}` });
      return z.NEVER;
    }
    return r.data;
  });
}

const nameField = (what: string) =>
  z.string().trim().min(1, `Give the ${what} a name.`).max(120, `Keep the ${what}'s name under 120 characters.`);
const longText = z.string().trim().max(4000, "Keep the text under 4000 characters.").default("");

export const plantInputSchema = z.object({
  name: nameField("plant"),
  description: longText,
  definition: engineDocument(plantDefinitionSchema, "plant definition"),
  origin: z.enum(["physical", "twin"]).default("physical"),
});
export type PlantInput = z.input<typeof plantInputSchema>;

/** An update replaces name, description and definition; the origin stays unless given. */
export const plantUpdateSchema = plantInputSchema.extend({ plantId: z.uuid("Unknown plant."), origin: z.enum(["physical", "twin"]).optional() });
export type PlantUpdate = z.input<typeof plantUpdateSchema>;

export const tuningSetInputSchema = z.object({
  plantRef: plantRefField,
  name: nameField("tuning set"),
  notes: longText,
  controller: engineDocument(controllerConfigSchema, "controller configuration"),
});
export type TuningSetInput = z.input<typeof tuningSetInputSchema>;

/** What the Bench keeps of results: any object; the figures the history shows must be numbers. */
const measure = z.number().nullable().optional();
const windowSummarySchema = z.looseObject({ iae: measure, overshootPct: measure, settlingTimeS: measure, riseTimeS: measure });
export const runResultsSchema = z.looseObject({
  wholeRun: z.looseObject({ trueTemperature: windowSummarySchema.optional(), filteredPv: windowSummarySchema.optional() }).optional(),
  windows: z.array(z.looseObject({ kind: z.string().optional(), trueTemperature: windowSummarySchema.optional() })).optional(),
  safetyTrips: z.array(z.unknown()).optional(),
  heaterEnergyKWh: z.number().optional(),
});

export const runInputSchema = z.object({
  plantRef: plantRefField,
  title: z.string().trim().max(160, "Keep the title under 160 characters.").default(""),
  drill: engineDocument(drillSchema, "drill"),
  controller: engineDocument(controllerConfigSchema, "controller configuration"),
  seed: z.number().int("The seed must be a whole number.").min(0).max(4294967295),
  actionLog: engineDocument(actionLogSchema, "action log"),
  results: engineDocument(runResultsSchema, "results record"),
  engineVersion: z.string().trim().min(1, "The engine version is missing.").max(40),
  durationS: z.number().finite().positive("The run has no duration.").max(7 * 24 * 3600),
});
export type RunInput = z.input<typeof runInputSchema>;

/** A form field carrying one JSON document (forms post FormData; the hidden field is `payload`),
 * at most `maxChars` long, parsed and validated with `schema`; its first problem is the message. */
export function jsonPayloadField<S extends z.ZodType>(schema: S, maxChars: number) {
  return z
    .string({ error: "Nothing was sent." })
    .max(maxChars, "This is too large to save.")
    .transform((text, ctx): z.output<S> => {
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch {
        ctx.addIssue({ code: "custom", message: "The form sent something that is not JSON." });
        return z.NEVER;
      }
      const r = schema.safeParse(json);
      if (!r.success) {
        ctx.addIssue({ code: "custom", message: firstIssue(r.error) });
        return z.NEVER;
      }
      return r.data;
    });
}

function validated<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const r = schema.safeParse(input);
  if (!r.success) throw new ActionRefused(firstIssue(r.error));
  return r.data;
}

// ---- visibility ----

/** Plants the user may read: own, or shared within the organisation. */
export const readablePlant = (user: BenchUser) =>
  or(eq(plants.ownerId, user.id), and(eq(plants.organizationId, user.organizationId), eq(plants.shared, true)));

async function assertReadableRef(tx: Transaction, user: BenchUser, ref: string): Promise<void> {
  const parsed = parsePlantRef(ref);
  if (!parsed) throw new ActionRefused("Choose a plant (a preset or one of your plants).");
  if (parsed.kind === "preset") {
    if (!findPreset(parsed.presetId)) throw new ActionRefused("That preset does not exist.");
    return;
  }
  const [row] = await tx.select({ id: plants.id }).from(plants).where(and(eq(plants.id, parsed.plantId), readablePlant(user)));
  if (!row) throw new ActionRefused("That plant does not exist.");
}

/** The user's own plant, locked for the change; refuses others' plants without saying more than needed. */
async function ownPlantForUpdate(tx: Transaction, user: BenchUser, plantId: string) {
  if (!isUuid(plantId)) throw new ActionRefused("That plant does not exist.");
  const [row] = await tx.select().from(plants).where(and(eq(plants.id, plantId), readablePlant(user))).for("update");
  if (!row) throw new ActionRefused("That plant does not exist.");
  if (row.ownerId !== user.id) throw new ActionRefused("Only the owner of this plant can change it.");
  return row;
}

// ---- plants ----

/** The columns of a new plant row owned by the user (the definition carries the plant's name too). */
export function newPlantValues(user: BenchUser, p: z.output<typeof plantInputSchema>) {
  return {
    organizationId: user.organizationId,
    ownerId: user.id,
    name: p.name,
    description: p.description,
    definition: { ...p.definition, name: p.name },
    origin: p.origin,
  };
}

export async function createPlant(user: BenchUser, input: PlantInput): Promise<{ id: string; ref: string }> {
  const p = validated(plantInputSchema, input);
  const [row] = await getDb().transaction((tx) =>
    tx
      .insert(plants)
      .values(newPlantValues(user, p))
      .returning({ id: plants.id }),
  );
  return { id: row.id, ref: plantRefOf(row.id) };
}

export async function updatePlant(user: BenchUser, input: PlantUpdate): Promise<void> {
  const p = validated(plantUpdateSchema, input);
  await getDb().transaction(async (tx) => {
    const row = await ownPlantForUpdate(tx, user, p.plantId);
    await tx
      .update(plants)
      .set({ name: p.name, description: p.description, definition: { ...p.definition, name: p.name }, origin: p.origin ?? row.origin, updatedAt: new Date() })
      .where(eq(plants.id, p.plantId));
  });
}

/** Deletes the plant with the owner's tuning sets and saved runs for it. Other users' saved runs of
 * a shared plant stay: each carries its drill (with the plant in full), so it still replays. */
export async function deletePlant(user: BenchUser, plantId: string): Promise<void> {
  await getDb().transaction(async (tx) => {
    await ownPlantForUpdate(tx, user, plantId);
    const ref = plantRefOf(plantId.toLowerCase());
    await tx.delete(tuningSets).where(and(eq(tuningSets.ownerId, user.id), eq(tuningSets.plantRef, ref)));
    await tx.delete(savedRuns).where(and(eq(savedRuns.ownerId, user.id), eq(savedRuns.plantRef, ref)));
    await tx.delete(plants).where(eq(plants.id, plantId));
  });
}

export async function setPlantShared(user: BenchUser, plantId: string, shared: boolean): Promise<void> {
  await getDb().transaction(async (tx) => {
    await ownPlantForUpdate(tx, user, plantId);
    await tx.update(plants).set({ shared, updatedAt: new Date() }).where(eq(plants.id, plantId));
  });
}

// ---- tuning sets ----

function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err, depth = 0; e && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    if ((e as { code?: unknown }).code === "23505") return true;
  }
  return false;
}

export async function createTuningSet(user: BenchUser, input: TuningSetInput): Promise<{ id: string }> {
  const p = validated(tuningSetInputSchema, input);
  const taken = () => new ActionRefused(`You already have a tuning set named "${p.name}" for this plant. Choose another name or delete the old one.`);
  try {
    return await getDb().transaction(async (tx) => {
      await assertReadableRef(tx, user, p.plantRef);
      const [existing] = await tx
        .select({ id: tuningSets.id })
        .from(tuningSets)
        .where(and(eq(tuningSets.ownerId, user.id), eq(tuningSets.plantRef, p.plantRef), eq(tuningSets.name, p.name)));
      if (existing) throw taken();
      const [row] = await tx
        .insert(tuningSets)
        .values({ organizationId: user.organizationId, ownerId: user.id, plantRef: p.plantRef, name: p.name, notes: p.notes, controller: p.controller })
        .returning({ id: tuningSets.id });
      return { id: row.id };
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw taken(); // a concurrent save of the same name
    throw err;
  }
}

export async function deleteTuningSet(user: BenchUser, id: string): Promise<void> {
  if (!isUuid(id)) throw new ActionRefused("That tuning set does not exist.");
  const gone = await getDb().transaction((tx) =>
    tx.delete(tuningSets).where(and(eq(tuningSets.id, id), eq(tuningSets.ownerId, user.id))).returning({ id: tuningSets.id }),
  );
  if (gone.length === 0) throw new ActionRefused("That tuning set does not exist.");
}

// ---- saved runs ----

export async function createRun(user: BenchUser, input: RunInput): Promise<{ id: string }> {
  const p = validated(runInputSchema, input);
  return getDb().transaction(async (tx) => {
    await assertReadableRef(tx, user, p.plantRef);
    const title = p.title || `${p.drill.title} · seed ${p.seed}`;
    const [row] = await tx
      .insert(savedRuns)
      .values({
        organizationId: user.organizationId,
        ownerId: user.id,
        plantRef: p.plantRef,
        title,
        drill: p.drill as Record<string, unknown>,
        controller: p.controller,
        seed: p.seed,
        actionLog: p.actionLog,
        results: p.results,
        engineVersion: p.engineVersion,
        durationS: p.durationS,
      })
      .returning({ id: savedRuns.id });
    return { id: row.id };
  });
}

export async function deleteRun(user: BenchUser, id: string): Promise<void> {
  if (!isUuid(id)) throw new ActionRefused("That saved run does not exist.");
  const gone = await getDb().transaction((tx) =>
    tx.delete(savedRuns).where(and(eq(savedRuns.id, id), eq(savedRuns.ownerId, user.id))).returning({ id: savedRuns.id }),
  );
  if (gone.length === 0) throw new ActionRefused("That saved run does not exist.");
}

/** For tests and housekeeping: how many rows the user owns in each table. */
export async function countOwnedRows(userIds: string[]) {
  const db = getDb();
  const [p, t, r] = await Promise.all([
    db.select({ id: plants.id }).from(plants).where(inArray(plants.ownerId, userIds)),
    db.select({ id: tuningSets.id }).from(tuningSets).where(inArray(tuningSets.ownerId, userIds)),
    db.select({ id: savedRuns.id }).from(savedRuns).where(inArray(savedRuns.ownerId, userIds)),
  ]);
  return { plants: p.length, tuningSets: t.length, savedRuns: r.length };
}
