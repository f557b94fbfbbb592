// Demo classroom data: the ladder drill (seed-drills.ts) assigned to the demo cohort, with verified
// attempts by five of its trainees so the standings, the review and the feedback have something to
// show on a fresh install. The attempts are honest: each is replayed here with the engine
// (sim/drill/verify-attempt.ts), exactly as the worker verifies a real submission. The tunings are
// invented for the demo. Idempotent: a fixed assignment id; attempts only when it has none.
import { randomUUID } from "node:crypto";
import { and, eq, sql as dsql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { officialColumns } from "../app/_lib/classroom/verify";
import { replayAttempt } from "../sim/drill/verify-attempt";
import { assignments, attemptFeedback, attempts, cohorts, drillVersions, users } from "./schema";
import { DEMO_COHORT, demoPeople } from "./demo-people";
import { DEMO_DRILL_IDS } from "./seed-drills";

export const DEMO_ASSIGNMENT_ID = "6b1d2c40-7a1e-4c55-9e0a-3f8d2b6c1b01";

/** Who tried what (invented): a gain × integral-time spread around the reference (Kc 12, Ti 360 s). */
const DEMO_ATTEMPTS: { trainee: string; kc: number; ti: number; td?: number; hoursAgo: number }[] = [
  { trainee: "arjun", kc: 12, ti: 360, hoursAgo: 50 },
  { trainee: "arjun", kc: 10, ti: 300, td: 40, hoursAgo: 26 },
  { trainee: "bea", kc: 24, ti: 200, hoursAgo: 30 },
  { trainee: "cormac", kc: 6, ti: 720, hoursAgo: 28 },
  { trainee: "dalia", kc: 14, ti: 340, td: 30, hoursAgo: 20 },
  { trainee: "dalia", kc: 15, ti: 330, td: 40, hoursAgo: 6 },
  { trainee: "emil", kc: 18, ti: 280, hoursAgo: 3 },
];

export async function seedDemoClassroom(url: string): Promise<void> {
  const client = postgres(url, { max: 1, onnotice: () => {} });
  const db = drizzle(client);
  try {
    await db.transaction(async (tx) => {
      const [cohort] = await tx.select().from(cohorts).where(eq(cohorts.name, DEMO_COHORT));
      const [instructor] = await tx.select().from(users).where(eq(dsql`lower(${users.email})`, demoPeople.instructors[0].email));
      const [version] = await tx.select().from(drillVersions).where(and(eq(drillVersions.drillId, DEMO_DRILL_IDS.ladder), eq(drillVersions.version, 1)));
      if (!cohort || !instructor || !version) throw new Error("the demo cohort, instructor and drills must be seeded first");
      const now = Date.now();
      await tx
        .insert(assignments)
        .values({
          id: DEMO_ASSIGNMENT_ID,
          organizationId: cohort.organizationId,
          cohortId: cohort.id,
          drillVersionId: version.id,
          title: "Week 3 — cure ladder on C-2",
          opensAt: new Date(now - 3 * 86_400_000),
          dueAt: new Date(now + 10 * 86_400_000),
          attemptLimit: 3,
          lateRule: "accept-penalty",
          latePenaltyPercent: 10,
          visibility: "initials",
          createdBy: instructor.id,
          // the demo does not e-mail anybody
          openNoticeSentAt: new Date(now - 3 * 86_400_000),
        })
        .onConflictDoNothing({ target: assignments.id });
      const [existing] = await tx.select({ id: attempts.id }).from(attempts).where(eq(attempts.assignmentId, DEMO_ASSIGNMENT_ID)).limit(1);
      if (existing) return;
      const doc = version.document as { referenceTuning: Record<string, unknown>; noise: { seed: number } };
      const numbers = new Map<string, number>();
      for (const a of DEMO_ATTEMPTS) {
        const email = `${a.trainee}@students.kestrelfen.example`;
        const [t] = await tx.select().from(users).where(eq(dsql`lower(${users.email})`, email));
        const number = (numbers.get(email) ?? 0) + 1;
        numbers.set(email, number);
        const controller = { ...doc.referenceTuning, kc: a.kc, ti: a.ti, td: a.td ?? 0 };
        const official = replayAttempt({ drill: version.document, controller, actionLog: [], seed: doc.noise.seed, latePenaltyFactor: 1 });
        const at = new Date(now - a.hoursAgo * 3_600_000);
        const [row] = await tx
          .insert(attempts)
          .values({
            assignmentId: DEMO_ASSIGNMENT_ID,
            traineeId: t.id,
            drillVersionId: version.id,
            number,
            seed: doc.noise.seed,
            startedAt: new Date(at.getTime() - 20 * 60_000),
            submittedAt: at,
            submissionKey: randomUUID(),
            controller,
            actionLog: [],
            claimedScore: official.score.score,
            claimedFingerprint: official.fingerprint,
            ...officialColumns(official),
            verifiedAt: new Date(at.getTime() + 2000),
            verifyRuns: 1,
          })
          .returning();
        if (a.trainee === "bea") {
          await tx.insert(attemptFeedback).values({
            attemptId: row.id,
            authorId: instructor.id,
            body: "Fastest settling of the group, but the first step overshoots by more than a degree: close to the 1.5 °C the job allows. Try a setpoint weight b below 1, or a touch less Kc, on your next attempt.",
            createdAt: new Date(at.getTime() + 3_600_000),
          });
        }
      }
    });
  } finally {
    await client.end();
  }
}
