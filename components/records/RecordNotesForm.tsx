"use client";
import type { ActionResult } from "@/app/_lib/action";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

/** The author's title and notes, editable until the record is signed off. */
export function RecordNotesForm({ recordId, title, notes, action }: { recordId: string; title: string; notes: string; action: Action }) {
  return (
    <ActionForm action={action} submitLabel="Save notes" className="space-y-3 print:hidden">
      <input type="hidden" name="recordId" value={recordId} />
      <Field label="Title" name="title" defaultValue={title} required maxLength={160} />
      <label className="block text-sm">
        <span className="mb-1 block font-medium text-ink-soft">Notes</span>
        <textarea
          name="notes"
          defaultValue={notes}
          maxLength={8000}
          rows={5}
          className="w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2 text-ink focus:border-ink"
        />
        <span className="mt-1 block text-xs text-ink-faint">What was decided and why: filter, sample time, anything left to check on site.</span>
      </label>
    </ActionForm>
  );
}
