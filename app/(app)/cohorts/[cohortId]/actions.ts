"use server";
import { and, eq, isNull } from "drizzle-orm";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { inviteByEmail } from "@/app/_lib/accounts";
import { createAssignment as assign, createAssignmentSchema } from "@/app/_lib/classroom/assignments";
import { ActionRefused, defineAction } from "@/app/_lib/action";
import { emailField, uuidField } from "@/app/_lib/fields";
import { getDb } from "@/db/client";
import { cohortMemberships } from "@/db/schema";

const inviteForm = z.object({ cohortId: uuidField, email: emailField });

/** Instructors of a cohort (and admins) invite trainees into it by e-mail. */
export const inviteTrainee = defineAction(
  inviteForm,
  ({ cohortId }) => ({ roles: ["instructor", "admin"], cohortId, cohortRole: "instructor" }),
  async ({ cohortId, email }, user) => {
    await inviteByEmail(user!, { email, role: "trainee", cohortId });
    revalidatePath(`/cohorts/${cohortId}`);
    return { ok: true, message: `Invitation sent to ${email}.` };
  },
);

const removeForm = z.object({ cohortId: uuidField, userId: z.string().min(1).max(64) });

/** Removal hides a trainee from the roster (and later the standings); their records stay. */
export const removeTrainee = defineAction(
  removeForm,
  ({ cohortId }) => ({ roles: ["instructor", "admin"], cohortId, cohortRole: "instructor" }),
  async ({ cohortId, userId }) => {
    const removed = await getDb()
      .update(cohortMemberships)
      .set({ removedAt: new Date() })
      .where(and(eq(cohortMemberships.cohortId, cohortId), eq(cohortMemberships.userId, userId), eq(cohortMemberships.role, "trainee"), isNull(cohortMemberships.removedAt)))
      .returning();
    if (removed.length === 0) throw new ActionRefused("That trainee is not on this roster.");
    revalidatePath(`/cohorts/${cohortId}`);
    return { ok: true, message: "Trainee removed from the roster. Their records are kept." };
  },
);

/** Instructors of the cohort (and admins) assign a published drill version to it. */
export const createAssignment = defineAction(
  createAssignmentSchema,
  ({ cohortId }) => ({ roles: ["instructor", "admin"], cohortId, cohortRole: "instructor" }),
  async (input, user) => {
    const { opensNow } = await assign(user!, input);
    revalidatePath(`/cohorts/${input.cohortId}`);
    return { ok: true, message: opensNow ? "Assigned. The trainees are being e-mailed that it is open." : "Assigned. The trainees will be e-mailed when it opens." };
  },
);
