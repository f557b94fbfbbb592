"use server";
import { revalidatePath } from "next/cache";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { inviteByEmail, setUserActive } from "@/app/_lib/accounts";
import { ActionRefused, defineAction } from "@/app/_lib/action";
import { emailField, timeZoneField, uuidField } from "@/app/_lib/fields";
import { getDb } from "@/db/client";
import { cohortMemberships, cohorts, users } from "@/db/schema";

const adminOnly = { roles: ["admin"] } as const;

const inviteUserForm = z.object({
  email: emailField,
  role: z.enum(["admin", "instructor", "trainee"], "Choose a role."),
  cohortId: z.union([z.literal(""), uuidField]).transform((v) => v || null),
});

/** Admins create users by invitation: the new user chooses their own password from the link. */
export const inviteUser = defineAction(inviteUserForm, adminOnly, async ({ email, role, cohortId }, user) => {
  if (role === "admin" && cohortId) throw new ActionRefused("Admins are not cohort members; leave the cohort empty.");
  await inviteByEmail(user!, { email, role, cohortId });
  revalidatePath("/admin/users");
  return { ok: true, message: `Invitation sent to ${email} (${role}).` };
});

const activeForm = z.object({ userId: z.string().min(1).max(64), active: z.enum(["true", "false"]) });

export const setActive = defineAction(activeForm, adminOnly, async ({ userId, active }, user) => {
  if (userId === user!.id) throw new ActionRefused("You cannot deactivate your own account.");
  await setUserActive(user!.organizationId, userId, active === "true");
  revalidatePath("/admin/users");
  return { ok: true, message: active === "true" ? "User reactivated." : "User deactivated; their sessions were ended." };
});

const cohortForm = z.object({
  name: z.string().trim().min(2, "Name the cohort (at least 2 characters).").max(100, "Keep the name under 100 characters."),
  timeZone: timeZoneField,
});

export const createCohort = defineAction(cohortForm, adminOnly, async ({ name, timeZone }, user) => {
  const created = await getDb()
    .insert(cohorts)
    .values({ organizationId: user!.organizationId, name, timeZone })
    .onConflictDoNothing()
    .returning();
  if (created.length === 0) throw new ActionRefused(`A cohort called "${name}" already exists.`);
  revalidatePath("/admin/cohorts");
  return { ok: true, message: `Cohort "${name}" created.` };
});

const assignForm = z.object({ cohortId: uuidField, userId: z.string().min(1).max(64) });

export const addInstructor = defineAction(assignForm, adminOnly, async ({ cohortId, userId }, user) => {
  await getDb().transaction(async (tx) => {
    const [cohort] = await tx.select().from(cohorts).where(and(eq(cohorts.id, cohortId), eq(cohorts.organizationId, user!.organizationId)));
    const [instructor] = await tx.select().from(users).where(and(eq(users.id, userId), eq(users.organizationId, user!.organizationId), eq(users.role, "instructor")));
    if (!cohort || !instructor) throw new ActionRefused("Choose a cohort and an instructor of your organisation.");
    await tx
      .insert(cohortMemberships)
      .values({ cohortId, userId, role: "instructor" })
      .onConflictDoUpdate({ target: [cohortMemberships.cohortId, cohortMemberships.userId], set: { role: "instructor", removedAt: null } });
  });
  revalidatePath("/admin/cohorts");
  return { ok: true, message: "Instructor added to the cohort." };
});
