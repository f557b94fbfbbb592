"use client";
import type { ActionResult } from "@/app/_lib/action";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

/** The author signs the record off once: a name and the date; afterwards it is frozen. */
export function SignOffForm({ recordId, today, suggestedName, action }: { recordId: string; today: string; suggestedName: string; action: Action }) {
  return (
    <ActionForm action={action} submitLabel="Sign off and freeze" className="space-y-3 print:hidden">
      <input type="hidden" name="recordId" value={recordId} />
      <p className="text-sm text-ink-soft">Signing off freezes the record: its notes, title and results can no longer be changed.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Signed off by" name="name" defaultValue={suggestedName} required maxLength={120} />
        <Field label="Date" name="date" type="date" defaultValue={today} required hint="yyyy-mm-dd, not in the future" />
      </div>
    </ActionForm>
  );
}
