"use server";
// The Bench's saved work as server actions. Forms post FormData: actions that carry a document
// take one hidden field `payload` holding JSON, parsed here with zod (the engine's schemas for
// plant definitions, controller configurations, drills and action logs). Every action needs a
// signed-in user (the guard, through defineAction); ownership and visibility are the rules of
// app/_lib/bench-store.ts, which writes in one transaction. Bad input writes nothing.
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction, type ActionResult } from "@/app/_lib/action";
import {
  createPlant,
  createRun,
  createTuningSet,
  deletePlant as removePlant,
  deleteRun as removeRun,
  deleteTuningSet as removeTuningSet,
  jsonPayloadField,
  plantInputSchema,
  plantUpdateSchema,
  runInputSchema,
  setPlantShared as shareOrUnshare,
  tuningSetInputSchema,
  updatePlant as changePlant,
} from "@/app/_lib/bench-store";

/** A successful save also names the new row, so the form can select it. */
export type SavedResult = ActionResult & { id?: string; ref?: string };

const payloadOf = <S extends z.ZodType>(schema: S, maxChars: number) => z.object({ payload: jsonPayloadField(schema, maxChars) });

const idForm = (what: string) => z.object({ id: z.uuid(`Unknown ${what}.`) });
const signedIn = {};
const revalidate = () => revalidatePath("/bench");

export const savePlant = defineAction(payloadOf(plantInputSchema, 200_000), signedIn, async ({ payload }, user) => {
  const { id, ref } = await createPlant(user!, payload);
  revalidate();
  const result: SavedResult = { ok: true, message: `Plant "${payload.name}" saved.`, id, ref };
  return result;
});

export const updatePlant = defineAction(payloadOf(plantUpdateSchema, 200_000), signedIn, async ({ payload }, user) => {
  await changePlant(user!, payload);
  revalidate();
  const result: SavedResult = { ok: true, message: `Plant "${payload.name}" updated.`, id: payload.plantId, ref: `plant:${payload.plantId}` };
  return result;
});

export const deletePlant = defineAction(idForm("plant"), signedIn, async ({ id }, user) => {
  await removePlant(user!, id);
  revalidate();
  return { ok: true, message: "Plant deleted, with your tuning sets and saved runs for it." };
});

export const setPlantShared = defineAction(
  z.object({ id: z.uuid("Unknown plant."), shared: z.enum(["true", "false"], { error: "Say whether to share." }).transform((s) => s === "true") }),
  signedIn,
  async ({ id, shared }, user) => {
    await shareOrUnshare(user!, id, shared);
    revalidate();
    return { ok: true, message: shared ? "Plant shared within your organisation." : "Plant is private again." };
  },
);

export const saveTuningSet = defineAction(payloadOf(tuningSetInputSchema, 50_000), signedIn, async ({ payload }, user) => {
  const { id } = await createTuningSet(user!, payload);
  revalidate();
  const result: SavedResult = { ok: true, message: `Tuning set "${payload.name}" saved.`, id };
  return result;
});

export const deleteTuningSet = defineAction(idForm("tuning set"), signedIn, async ({ id }, user) => {
  await removeTuningSet(user!, id);
  revalidate();
  return { ok: true, message: "Tuning set deleted." };
});

// Next refuses action bodies over 1 MB (serverActions.bodySizeLimit, not raised in next.config.mjs);
// 900 000 characters of JSON is some 15 000 logged actions plus the drill.
export const saveRun = defineAction(payloadOf(runInputSchema, 900_000), signedIn, async ({ payload }, user) => {
  const { id } = await createRun(user!, payload);
  revalidate();
  const result: SavedResult = { ok: true, message: "Run saved.", id };
  return result;
});

export const deleteRun = defineAction(idForm("saved run"), signedIn, async ({ id }, user) => {
  await removeRun(user!, id);
  revalidate();
  return { ok: true, message: "Saved run deleted." };
});
