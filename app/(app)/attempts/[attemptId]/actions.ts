"use server";
// Attempt actions: the trainee submits (idempotent by its submission key; the replay runs in the
// worker), staff of the cohort leave written feedback (shown in the app and e-mailed). Ownership
// and cohort rules are app/_lib/classroom/attempts.ts's; bad input writes nothing.
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { ActionRefused, defineAction, type ActionResult } from "@/app/_lib/action";
import { uuidField } from "@/app/_lib/fields";
import { FEEDBACK_MAX, leaveFeedback as leave, submitAttempt as submit } from "@/app/_lib/classroom/attempts";

// the payload is parsed again against attemptSubmissionSchema in submitAttempt
const submissionForm = z.object({ payload: z.string({ error: "Nothing was sent." }).min(2, "Nothing was sent.").max(4_000_000, "This submission is too large.") });

export const submitAttempt = defineAction(submissionForm, { roles: ["trainee"] }, async ({ payload }, user): Promise<ActionResult> => {
  let json: unknown;
  try {
    json = JSON.parse(payload);
  } catch {
    throw new ActionRefused("The submission is not JSON.");
  }
  const r = await submit(user!, json);
  revalidatePath(`/attempts/${r.attemptId}`);
  return { ok: true, message: r.repeated ? "Already submitted: the server is verifying it." : "Submitted: the server is re-running your attempt to verify it." };
});

const feedbackForm = z.object({
  attemptId: uuidField,
  body: z.string().trim().min(1, "Write some feedback first.").max(FEEDBACK_MAX, `Keep the feedback under ${FEEDBACK_MAX} characters.`),
});

export const leaveFeedback = defineAction(feedbackForm, { roles: ["instructor", "admin"] }, async ({ attemptId, body }, user) => {
  await leave(user!, attemptId, body);
  revalidatePath(`/attempts/${attemptId}`);
  return { ok: true, message: "Feedback saved and e-mailed to the trainee." };
});
