// Assignment rules, independent of Next (server actions call these after the guard; integration
// tests call them directly):
// - instructors of the cohort and the organisation's admins assign; the drill version must be
//   published (a trigger of migration 0003 refuses anything else) and viewable by the assigner
//   (own drill, one shared within the organisation, or any of the organisation's for an admin);
// - opening and due dates are entered in the cohort's time zone; due after opening;
// - an attempt limit of 1–50, a late rule (refuse / accept and mark late / accept with a score
//   penalty), and how trainees see the standings (full names, initials, only their own rank);
// - the cohort's trainees are e-mailed when the assignment opens (now, or by a queued job at the
//   opening time; notices.ts).
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { getDb } from "@/db/client";
import { viewableDrill } from "@/db/drill-queries";
import { assignments, cohorts, drills, drillVersions, type UserRole } from "@/db/schema";
import { ActionRefused } from "../action";
import { firstIssue } from "../drills";
import { uuidField } from "../fields";
import { enqueueOpenNotice } from "./queue";
import { zonedLocalToInstant } from "./zoned-time";

export interface ClassroomActor {
  id: string;
  organizationId: string;
  role: UserRole;
}

export const LATE_RULES = {
  refuse: "Refuse late submissions",
  "accept-marked": "Accept, marked late",
  "accept-penalty": "Accept with a score penalty",
} as const;

export const VISIBILITY = {
  names: "Full names",
  initials: "Initials",
  "own-rank": "Only their own rank",
} as const;

const localDateTime = z.string().trim().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "Enter a date and time.");

/** A form's "drillVersion" select ("<drillId>:<version>") becomes drillId and version. */
const splitDrillVersion = (raw: unknown) => {
  if (!raw || typeof raw !== "object") return raw;
  const o = raw as Record<string, unknown>;
  if (typeof o.drillVersion !== "string") return o;
  const [drillId, version] = o.drillVersion.split(":");
  const { drillVersion: _dv, ...rest } = o;
  return { ...rest, drillId, version };
};

export const createAssignmentSchema = z.preprocess(splitDrillVersion, z
  .object({
    cohortId: uuidField,
    drillId: z.uuid("Choose a drill version."),
    version: z.coerce.number({ error: "Choose a published version." }).int().positive("Choose a published version."),
    title: z.string().trim().max(160, "Keep the title under 160 characters.").default(""),
    opensAt: localDateTime,
    dueAt: localDateTime,
    attemptLimit: z.coerce.number({ error: "Enter the number of attempts." }).int("Whole attempts only.").min(1, "Allow at least one attempt.").max(50, "At most 50 attempts."),
    lateRule: z.enum(Object.keys(LATE_RULES) as [keyof typeof LATE_RULES], { error: "Choose a late rule." }),
    latePenaltyPercent: z.coerce.number().int("Whole percent only.").min(0, "The penalty is 0–100 %.").max(100, "The penalty is 0–100 %.").default(0),
    visibility: z.enum(Object.keys(VISIBILITY) as [keyof typeof VISIBILITY], { error: "Choose how trainees see the standings." }),
  })
  .refine((v) => v.lateRule !== "accept-penalty" || v.latePenaltyPercent > 0, { message: "Give the late penalty in percent (1–100).", path: ["latePenaltyPercent"] }));
export type CreateAssignmentInput = z.input<typeof createAssignmentSchema>;

/** Creates an assignment; the caller has checked that the user is staff of the cohort. */
export async function createAssignment(user: ClassroomActor, input: CreateAssignmentInput): Promise<{ id: string; opensNow: boolean }> {
  if (user.role !== "instructor" && user.role !== "admin") throw new ActionRefused("Only instructors and admins assign drills.");
  const p = createAssignmentSchema.safeParse(input);
  if (!p.success) throw new ActionRefused(firstIssue(p.error));
  const v = p.data;
  const db = getDb();
  const result = await db.transaction(async (tx) => {
    const [cohort] = await tx.select().from(cohorts).where(and(eq(cohorts.id, v.cohortId), eq(cohorts.organizationId, user.organizationId)));
    if (!cohort) throw new ActionRefused("That cohort does not exist.");
    const opensAt = zonedLocalToInstant(v.opensAt, cohort.timeZone);
    const dueAt = zonedLocalToInstant(v.dueAt, cohort.timeZone);
    if (!opensAt) throw new ActionRefused("opensAt: that date does not exist.");
    if (!dueAt) throw new ActionRefused("dueAt: that date does not exist.");
    if (dueAt <= opensAt) throw new ActionRefused("The due date must be after the opening date.");
    const [found] = await tx
      .select({ drill: drills, versionId: drillVersions.id, status: drillVersions.status })
      .from(drills)
      .innerJoin(drillVersions, and(eq(drillVersions.drillId, drills.id), eq(drillVersions.version, v.version)))
      .where(and(eq(drills.id, v.drillId), viewableDrill(user)));
    if (!found) throw new ActionRefused("That drill version does not exist.");
    if (found.status !== "published") throw new ActionRefused(`Version ${v.version} is a draft: publish it before assigning it.`);
    if (found.drill.archivedAt) throw new ActionRefused("That drill is archived.");
    const [row] = await tx
      .insert(assignments)
      .values({
        organizationId: user.organizationId,
        cohortId: cohort.id,
        drillVersionId: found.versionId,
        title: v.title || found.drill.title,
        opensAt,
        dueAt,
        attemptLimit: v.attemptLimit,
        lateRule: v.lateRule,
        latePenaltyPercent: v.lateRule === "accept-penalty" ? v.latePenaltyPercent : 0,
        visibility: v.visibility,
        createdBy: user.id,
      })
      .returning({ id: assignments.id, opensAt: assignments.opensAt });
    return row;
  });
  // the notice job runs at the opening time (at once if that has passed); sent after the commit,
  // so the job never sees an assignment that is not there
  await enqueueOpenNotice(result.id, result.opensAt);
  return { id: result.id, opensNow: result.opensAt.getTime() <= Date.now() };
}

/** Changes how trainees see the standings (staff of the assignment's cohort; the caller checked). */
export async function setStandingsVisibility(user: ClassroomActor, assignmentId: string, visibility: keyof typeof VISIBILITY): Promise<void> {
  const updated = await getDb()
    .update(assignments)
    .set({ visibility })
    .where(and(eq(assignments.id, assignmentId), eq(assignments.organizationId, user.organizationId)))
    .returning({ id: assignments.id });
  if (updated.length !== 1) throw new ActionRefused("That assignment does not exist.");
}
