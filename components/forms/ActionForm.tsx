"use client";
import { useActionState, type ReactNode } from "react";
import { useFormStatus } from "react-dom";
import type { ActionResult } from "@/app/_lib/action";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

/** A form bound to a server action, showing its outcome above the submit button. */
export function ActionForm({
  action,
  submitLabel,
  children,
  className = "space-y-4",
}: {
  action: Action;
  submitLabel: string;
  children: ReactNode;
  className?: string;
}) {
  const [state, formAction] = useActionState(action, { ok: true } as ActionResult);
  return (
    <form action={formAction} className={className}>
      {children}
      <FormOutcome state={state} />
      <SubmitButton label={submitLabel} />
    </form>
  );
}

export function FormOutcome({ state }: { state: ActionResult }) {
  if (!state.ok) {
    return (
      <p role="alert" data-testid="form-error" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-sm text-alarm">
        {state.error}
      </p>
    );
  }
  if (state.message) {
    return (
      <p role="status" data-testid="form-status" className="rounded-sm border border-ok/40 bg-paper-raised px-3 py-2 text-sm text-ok">
        {state.message}
      </p>
    );
  }
  return null;
}

export function SubmitButton({ label, tone = "primary" }: { label: string; tone?: "primary" | "quiet" }) {
  const { pending } = useFormStatus();
  const look =
    tone === "primary"
      ? "bg-ink text-paper hover:bg-ink-soft"
      : "border border-rule-strong bg-paper-raised text-ink hover:border-ink";
  return (
    <button type="submit" disabled={pending} className={`rounded-sm px-4 py-2 text-sm font-medium disabled:opacity-60 ${look}`}>
      {pending ? "Working…" : label}
    </button>
  );
}
