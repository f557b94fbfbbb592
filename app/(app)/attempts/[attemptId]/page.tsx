import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ActionRefused } from "@/app/_lib/action";
import { guardPage } from "@/app/_lib/guard";
import { attemptDetail, compareOptions } from "@/app/_lib/classroom/attempts";
import { drillSchema } from "@/sim/drill/schema";
import { AttemptRunner } from "@/components/attempts/AttemptRunner";
import { AttemptOutcome } from "@/components/attempts/AttemptOutcome";
import { FeedbackForm } from "@/components/attempts/FeedbackForm";
import { leaveFeedback, submitAttempt } from "./actions";

export const metadata: Metadata = { title: "Attempt" };

async function detailOrNull(user: Parameters<typeof attemptDetail>[0], id: string) {
  try {
    return await attemptDetail(user, id);
  } catch (err) {
    if (err instanceof ActionRefused) return null;
    throw err;
  }
}

export default async function AttemptPage({ params, searchParams }: { params: Promise<{ attemptId: string }>; searchParams: Promise<{ compare?: string }> }) {
  const { attemptId } = await params;
  const { compare } = await searchParams;
  const user = await guardPage();
  const attempt = await detailOrNull(user, attemptId);
  if (!attempt) notFound();

  if (attempt.status === "started") {
    if (attempt.trainee.id !== user.id) {
      return (
        <section className="space-y-2">
          <h1 className="text-xl font-semibold">
            {attempt.trainee.name} — attempt {attempt.number} of “{attempt.assignment.title}”
          </h1>
          <p className="text-sm text-ink-soft">Started {new Date(attempt.startedAt).toUTCString()}; not submitted yet.</p>
        </section>
      );
    }
    return (
      <AttemptRunner
        launch={{
          attemptId: attempt.id,
          assignmentId: attempt.assignment.id,
          assignmentTitle: attempt.assignment.title,
          drill: drillSchema.parse(attempt.drill),
          seed: attempt.seed,
          attemptNumber: attempt.number,
          attemptLimit: attempt.assignment.attemptLimit,
          dueAtIso: attempt.assignment.dueAt,
          timeZone: attempt.assignment.timeZone,
        }}
        submitAction={submitAttempt}
      />
    );
  }

  const other = attempt.canReview && compare && compare !== attempt.id ? await detailOrNull(user, compare) : null;
  const options = attempt.canReview ? await compareOptions(attempt.assignment.id, attempt.id) : [];
  return (
    <AttemptOutcome
      initial={attempt}
      compareWith={other && other.status === "verified" ? other : null}
      compareOptions={options}
      feedbackForm={attempt.canReview ? <FeedbackForm attemptId={attempt.id} action={leaveFeedback} /> : null}
    />
  );
}
