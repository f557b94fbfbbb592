"use client";
import type { ActionResult } from "@/app/_lib/action";
import { ActionForm } from "@/components/forms/ActionForm";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

/** An instructor's written feedback on an attempt: saved, shown to the trainee and e-mailed. */
export function FeedbackForm({ attemptId, action }: { attemptId: string; action: Action }) {
  return (
    <ActionForm action={action} submitLabel="Send feedback" className="space-y-3">
      <input type="hidden" name="attemptId" value={attemptId} />
      <label className="block text-sm">
        <span className="mb-1 block font-medium text-ink-soft">Written feedback to the trainee</span>
        <textarea name="body" required maxLength={4000} rows={4} className="w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2 text-ink focus:border-ink" />
        <span className="mt-1 block text-xs text-ink-faint">Shown on the attempt and sent to the trainee by e-mail.</span>
      </label>
    </ActionForm>
  );
}
