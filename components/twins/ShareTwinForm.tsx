"use client";
/** The owner's share toggle: private, or readable (not editable) by the organisation. */
import type { ActionResult } from "@/app/_lib/action";
import { ActionForm } from "@/components/forms/ActionForm";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

export function ShareTwinForm({ plantId, shared, action }: { plantId: string; shared: boolean; action: Action }) {
  return (
    <ActionForm action={action} submitLabel={shared ? "Make private" : "Share within my organisation"} className="flex flex-wrap items-center gap-3">
      <input type="hidden" name="id" value={plantId} />
      <input type="hidden" name="shared" value={shared ? "false" : "true"} />
      <span className="text-sm text-ink-soft">{shared ? "Shared: everyone in your organisation can read this twin and download its log." : "Private: only you can see this twin."}</span>
    </ActionForm>
  );
}
