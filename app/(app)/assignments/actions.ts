"use server";
// Assignment actions: a trainee starts an attempt (the server issues its id and seed and counts
// it at once; app/_lib/classroom/attempts.ts), staff change how trainees see the standings.
// The guard checks the assignment's cohort (member / instructor); the domain rules check the rest.
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { defineAction } from "@/app/_lib/action";
import { uuidField } from "@/app/_lib/fields";
import { setStandingsVisibility as setVisibility, VISIBILITY } from "@/app/_lib/classroom/assignments";
import { startAttempt as start } from "@/app/_lib/classroom/attempts";

const assignmentForm = z.object({ assignmentId: uuidField });

export const startAttempt = defineAction(
  assignmentForm,
  ({ assignmentId }) => ({ roles: ["trainee"], assignmentId, cohortRole: "member" }),
  async ({ assignmentId }, user) => {
    const { attemptId } = await start(user!, assignmentId);
    revalidatePath(`/assignments/${assignmentId}`);
    redirect(`/attempts/${attemptId}`);
  },
);

const visibilityForm = z.object({
  assignmentId: uuidField,
  visibility: z.enum(Object.keys(VISIBILITY) as [keyof typeof VISIBILITY], { error: "Choose how trainees see the standings." }),
});

export const setStandingsVisibility = defineAction(
  visibilityForm,
  ({ assignmentId }) => ({ roles: ["instructor", "admin"], assignmentId, cohortRole: "instructor" }),
  async ({ assignmentId, visibility }, user) => {
    await setVisibility(user!, assignmentId, visibility);
    revalidatePath(`/assignments/${assignmentId}`);
    return { ok: true, message: `Trainees now see: ${VISIBILITY[visibility].toLowerCase()}.` };
  },
);
