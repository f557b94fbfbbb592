"use client";
import { useActionState, useEffect } from "react";
import useSWR from "swr";
import type { ActionResult } from "@/app/_lib/action";
import { FormOutcome, SubmitButton } from "@/components/forms/ActionForm";
import { TableHead } from "@/components/tables/TableHead";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

interface RosterData {
  members: { userId: string; displayName: string; email: string; role: "trainee" | "instructor"; status: string; joinedAt: string | Date }[];
  pending: { id: string; email: string; role: string; expiresAt: string | Date }[];
}

const fetchJson = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

const dateFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

/** Roster table (fetched with SWR from the route handler) with the instructor's invite form. */
export function CohortRoster({ cohortId, initial, invite, remove }: { cohortId: string; initial?: RosterData; invite: Action; remove: Action }) {
  const key = `/api/cohorts/${cohortId}/roster`;
  const { data, error, mutate } = useSWR<RosterData>(key, fetchJson, { fallbackData: initial });
  const [inviteState, inviteAction] = useActionState(invite, { ok: true } as ActionResult);
  const [removeState, removeAction] = useActionState(remove, { ok: true } as ActionResult);
  useEffect(() => {
    void mutate();
  }, [inviteState, removeState, mutate]);

  return (
    <div className="space-y-6">
      <form action={inviteAction} className="flex flex-wrap items-end gap-3" aria-label="Invite a trainee">
        <input type="hidden" name="cohortId" value={cohortId} />
        <label className="block min-w-72 flex-1 text-sm">
          <span className="mb-1 block font-medium text-ink-soft">Invite a trainee by e-mail</span>
          <input name="email" type="email" required placeholder="name@example.org" className="w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2" />
        </label>
        <SubmitButton label="Send invitation" />
        <div className="basis-full">
          <FormOutcome state={inviteState} />
        </div>
      </form>

      {error ? <p role="alert" className="text-sm text-alarm">Roster unavailable: {String(error.message)}</p> : null}
      <FormOutcome state={removeState} />
      <table className="w-full border-collapse text-sm">
        <TableHead columns={["Name", "E-mail", "Role", "Joined", ""]} />
        <tbody>
          {data?.members.map((m) => (
            <tr key={m.userId} className="border-b border-rule" data-testid="roster-row">
              <td className="py-2">
                {m.displayName}
                {m.status !== "active" ? <span className="ml-2 text-xs text-ink-faint">(deactivated)</span> : null}
              </td>
              <td className="py-2 text-ink-soft">{m.email}</td>
              <td className="py-2">{m.role}</td>
              <td className="num py-2 text-ink-soft">{dateFmt.format(new Date(m.joinedAt))}</td>
              <td className="py-2 text-right">
                {m.role === "trainee" ? (
                  <form action={removeAction}>
                    <input type="hidden" name="cohortId" value={cohortId} />
                    <input type="hidden" name="userId" value={m.userId} />
                    <button type="submit" className="text-xs text-ink-faint hover:text-alarm">
                      Remove
                    </button>
                  </form>
                ) : null}
              </td>
            </tr>
          ))}
          {data?.pending.map((p) => (
            <tr key={p.id} className="border-b border-rule text-ink-faint">
              <td className="py-2 italic">invited</td>
              <td className="py-2">{p.email}</td>
              <td className="py-2">{p.role}</td>
              <td className="num py-2">expires {dateFmt.format(new Date(p.expiresAt))}</td>
              <td />
            </tr>
          ))}
          {!data && !error ? (
            <tr>
              <td colSpan={5} className="py-4 text-ink-faint">
                Loading roster…
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
