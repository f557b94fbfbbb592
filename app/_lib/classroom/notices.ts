// Classroom e-mail: the "assignment open" notice to a cohort's trainees (a queued job at the
// opening time, run by the worker) and an instructor's written feedback on an attempt.
import { and, eq, isNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { assignments, cohortMemberships, cohorts, users } from "@/db/schema";
import { appLink, sendMail } from "../mail";
import { formatInZone } from "./zoned-time";

export async function sendFeedbackMail(p: { to: string; traineeName: string; authorName: string; assignmentTitle: string; attemptNumber: number; attemptId: string; body: string }) {
  await sendMail({
    to: p.to,
    subject: `Feedback on your attempt ${p.attemptNumber} of "${p.assignmentTitle}"`,
    text: [`${p.authorName} left feedback on your attempt ${p.attemptNumber} of "${p.assignmentTitle}":`, "", p.body, "", `Open the attempt: ${appLink(`/attempts/${p.attemptId}`)}`].join("\n"),
  });
}

/**
 * E-mails the active trainees of the cohort that the assignment is open. Idempotent: the notice is
 * claimed by setting open_notice_sent_at in the same statement that checks it, and released again
 * if sending fails, so a retried job sends it once.
 */
export async function sendOpenNotice(assignmentId: string): Promise<{ sent: number; skipped?: string }> {
  const db = getDb();
  const [claimed] = await db
    .update(assignments)
    .set({ openNoticeSentAt: new Date() })
    .where(and(eq(assignments.id, assignmentId), isNull(assignments.openNoticeSentAt), isNull(assignments.archivedAt)))
    .returning();
  if (!claimed) return { sent: 0, skipped: "already sent, archived or gone" };
  if (claimed.opensAt.getTime() > Date.now() + 1000) {
    await db.update(assignments).set({ openNoticeSentAt: null }).where(eq(assignments.id, assignmentId));
    return { sent: 0, skipped: "not open yet" };
  }
  try {
    const [cohort] = await db.select().from(cohorts).where(eq(cohorts.id, claimed.cohortId));
    const trainees = await db
      .select({ email: users.email, name: users.displayName })
      .from(cohortMemberships)
      .innerJoin(users, eq(users.id, cohortMemberships.userId))
      .where(and(eq(cohortMemberships.cohortId, claimed.cohortId), eq(cohortMemberships.role, "trainee"), isNull(cohortMemberships.removedAt), eq(users.status, "active")));
    for (const t of trainees) {
      await sendMail({
        to: t.email,
        subject: `New drill assigned: ${claimed.title}`,
        text: [
          `Hello ${t.name},`,
          "",
          `"${claimed.title}" is open for ${cohort.name}.`,
          `Due ${formatInZone(claimed.dueAt, cohort.timeZone)} · ${claimed.attemptLimit} attempt${claimed.attemptLimit === 1 ? "" : "s"}.`,
          "",
          `Read how it is scored and start an attempt: ${appLink(`/assignments/${claimed.id}`)}`,
        ].join("\n"),
      });
    }
    return { sent: trainees.length };
  } catch (err) {
    await db.update(assignments).set({ openNoticeSentAt: null }).where(eq(assignments.id, assignmentId));
    throw err;
  }
}
