"use server";
// Tuning record actions. Every one needs a signed-in user (the guard, through defineAction);
// who may do what is the rule of app/_lib/records: any user writes a record from their own
// tuning set on a plant they can read; only its author edits the notes and signs it off, once.
// The request from the pre-commissioning flow travels as JSON in the hidden field `payload`.
// Bad input writes nothing.
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction, type ActionResult } from "@/app/_lib/action";
import { jsonPayloadField } from "@/app/_lib/bench-store";
import { createTuningRecord as create } from "@/app/_lib/records/create-record";
import { recordRequestSchema } from "@/app/_lib/records/record-document";
import { recordNotesSchema, signOffRecord, signOffSchema, updateRecordNotes } from "@/app/_lib/records/update-record";

/** A written record also names its row, so the flow can go to /records/<id>. */
export type RecordActionResult = ActionResult & { id?: string };

const signedIn = {};
const revalidate = (id?: string) => {
  revalidatePath("/records");
  if (id) revalidatePath(`/records/${id}`);
};

// Next refuses action bodies over serverActions.bodySizeLimit (4 MB); eight drills are far less.
export const createTuningRecord = defineAction(z.object({ payload: jsonPayloadField(recordRequestSchema, 2_000_000) }), signedIn, async ({ payload }, user) => {
  const { id } = await create(user!, payload);
  revalidate(id);
  const result: RecordActionResult = { ok: true, message: `Tuning record "${payload.title}" written.`, id };
  return result;
});

export const updateTuningRecord = defineAction(recordNotesSchema, signedIn, async (input, user) => {
  await updateRecordNotes(user!, input);
  revalidate(input.recordId);
  return { ok: true, message: "Record saved." };
});

export const signOffTuningRecord = defineAction(signOffSchema, signedIn, async (input, user) => {
  await signOffRecord(user!, input);
  revalidate(input.recordId);
  return { ok: true, message: `Signed off by ${input.name} on ${input.date}. The record is now frozen.` };
});
