"use server";
// Drill builder actions. Instructors and admins only (the guard, through defineAction; trainees
// are refused); ownership, sharing and version rules are those of app/_lib/drills.ts, which
// writes in one transaction. A draft's document travels as JSON in the hidden field `payload`
// and is validated with the engine's drillSchema there; its first problem names the field.
// Bad input writes nothing.
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { defineAction, type ActionResult } from "@/app/_lib/action";
import {
  archiveDrill as archiveOrRestore,
  createDrill as create,
  createDrillSchema,
  duplicateDrill as duplicate,
  newDraftFromPublished as newDraft,
  publishDraft as publish,
  saveDraft as save,
  setDrillShared as share,
} from "@/app/_lib/drills";

/** A drill action's outcome; `version` names the version written. */
export type DrillActionResult = ActionResult & { version?: number };

const builders = { roles: ["instructor", "admin"] as const };
const drillId = z.uuid("Unknown drill.");
const flag = (what: string) => z.enum(["true", "false"], { error: `Say whether to ${what}.` }).transform((s) => s === "true");

const revalidate = (id?: string) => {
  revalidatePath("/drills");
  if (id) revalidatePath(`/drills/${id}`);
};

export const createDrill = defineAction(createDrillSchema, builders, async (input, user) => {
  const { id } = await create(user!, input);
  revalidate();
  redirect(`/drills/${id}`);
});

// Next refuses action bodies over 1 MB; a drill document is a few kB.
const payloadJson = z
  .string({ error: "Nothing was sent." })
  .max(200_000, "This drill is too large to save.")
  .transform((text, ctx): unknown => {
    try {
      return JSON.parse(text);
    } catch {
      ctx.addIssue({ code: "custom", message: "The form sent something that is not JSON." });
      return z.NEVER;
    }
  });

export const saveDraft = defineAction(z.object({ drillId, payload: payloadJson }), builders, async ({ drillId, payload }, user) => {
  const { version, created } = await save(user!, drillId, payload);
  revalidate(drillId);
  const result: DrillActionResult = { ok: true, message: created ? `Saved as draft version ${version}.` : `Draft version ${version} saved.`, version };
  return result;
});

export const publishDraft = defineAction(z.object({ drillId }), builders, async ({ drillId }, user) => {
  const { version } = await publish(user!, drillId);
  revalidate(drillId);
  const result: DrillActionResult = { ok: true, message: `Version ${version} published: it is frozen from now on.`, version };
  return result;
});

export const newDraftFromPublished = defineAction(
  z.object({ drillId, fromVersion: z.coerce.number().int().positive().optional() }),
  builders,
  async ({ drillId, fromVersion }, user) => {
    const { version } = await newDraft(user!, drillId, fromVersion);
    revalidate(drillId);
    const result: DrillActionResult = { ok: true, message: `Draft version ${version} opened.`, version };
    return result;
  },
);

export const duplicateDrill = defineAction(z.object({ drillId }), builders, async ({ drillId }, user) => {
  const { id } = await duplicate(user!, drillId);
  revalidate();
  redirect(`/drills/${id}`);
});

export const setDrillShared = defineAction(z.object({ drillId, shared: flag("share") }), builders, async ({ drillId, shared }, user) => {
  await share(user!, drillId, shared);
  revalidate(drillId);
  return { ok: true, message: shared ? "Shared with the instructors of your organisation." : "Private again." };
});

export const archiveDrill = defineAction(z.object({ drillId, archived: flag("archive").default(true) }), builders, async ({ drillId, archived }, user) => {
  await archiveOrRestore(user!, drillId, archived);
  revalidate(drillId);
  return { ok: true, message: archived ? "Drill archived." : "Drill restored." };
});
