"use client";
import { useActionState } from "react";
import type { ActionResult } from "@/app/_lib/action";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

export function UserStatusButton({ userId, active, action }: { userId: string; active: boolean; action: Action }) {
  const [state, formAction, pending] = useActionState(action, { ok: true } as ActionResult);
  return (
    <form action={formAction} className="inline-flex items-center gap-2">
      <input type="hidden" name="userId" value={userId} />
      <input type="hidden" name="active" value={active ? "false" : "true"} />
      {!state.ok ? <span className="text-xs text-alarm">{state.error}</span> : null}
      <button type="submit" disabled={pending} className={`text-xs ${active ? "text-ink-faint hover:text-alarm" : "text-ink-soft hover:text-ink"}`}>
        {active ? "Deactivate" : "Reactivate"}
      </button>
    </form>
  );
}
