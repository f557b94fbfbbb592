"use client";
/** The instructor's drill list (own drills first, then the organisation's shared ones), fetched
 * with SWR from /api/drills, and the New drill form (title and a starting point). */
import { useState } from "react";
import Link from "next/link";
import useSWR from "swr";
import type { ActionResult } from "@/app/_lib/action";
import { ActionForm } from "@/components/forms/ActionForm";
import { TableHead } from "@/components/tables/TableHead";
import type { DrillListItem } from "@/db/drill-queries";
import type { DrillStarter } from "./starters";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

const fetchJson = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

const dateFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

function statusOf(d: DrillListItem): string {
  if (d.draftVersion !== null && d.publishedVersions.length) return `published v${d.publishedVersions.at(-1)} · draft v${d.draftVersion}`;
  if (d.draftVersion !== null) return `draft v${d.draftVersion}`;
  return `published v${d.latestVersion}`;
}

export function DrillList({ initial, starters, createDrill }: { initial: DrillListItem[]; starters: readonly DrillStarter[]; createDrill: Action }) {
  const [archived, setArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const key = archived ? "/api/drills?archived=1" : "/api/drills";
  const { data, error } = useSWR<{ drills: DrillListItem[] }>(key, fetchJson, archived ? undefined : { fallbackData: { drills: initial } });
  const list = data?.drills;
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <button type="button" onClick={() => setCreating((c) => !c)} aria-expanded={creating} className="rounded-sm bg-ink px-4 py-2 text-sm font-medium text-paper hover:bg-ink-soft">
          New drill
        </button>
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} /> include archived
        </label>
      </div>
      {creating ? (
        <ActionForm action={createDrill} submitLabel="Create draft" className="max-w-xl space-y-3 rounded-sm border border-rule bg-paper-raised p-4">
          <label className="block text-sm">
            <span className="mb-1 block font-medium text-ink-soft">Title</span>
            <input name="title" required maxLength={160} placeholder="e.g. Door opened during a cure" className="w-full rounded-sm border border-rule-strong bg-paper px-3 py-2" />
          </label>
          <fieldset className="space-y-1 text-sm">
            <legend className="mb-1 font-medium text-ink-soft">Start from</legend>
            {starters.map((s, i) => (
              <label key={s.id} className="flex items-start gap-2">
                <input type="radio" name="starter" value={s.id} defaultChecked={i === 0} className="mt-1" />
                <span>
                  {s.title} <span className="block text-xs text-ink-faint">{s.summary}</span>
                </span>
              </label>
            ))}
          </fieldset>
        </ActionForm>
      ) : null}
      {error ? <p role="alert" className="text-sm text-alarm">Drills unavailable: {String(error.message)}</p> : null}
      <table className="w-full border-collapse text-sm" data-testid="drill-list">
        <TableHead columns={["Drill", "Owner", "Status", "Published", "Shared", "Changed"]} />
        <tbody>
          {list?.map((d) => (
            <tr key={d.id} className="border-b border-rule" data-testid="drill-row">
              <td className="py-2">
                <Link href={`/drills/${d.id}`}>{d.title}</Link>
                {d.archivedAt ? <span className="ml-2 text-xs text-ink-faint">(archived)</span> : null}
              </td>
              <td className="py-2 text-ink-soft">{d.mine ? "you" : d.ownerName}</td>
              <td className="num py-2">{statusOf(d)}</td>
              <td className="num py-2 text-ink-soft">{d.publishedVersions.length ? d.publishedVersions.map((v) => `v${v}`).join(", ") : "—"}</td>
              <td className="py-2 text-ink-soft">{d.sharedWithOrg ? "organisation" : "private"}</td>
              <td className="num py-2 text-ink-soft">{dateFmt.format(new Date(d.updatedAt))}</td>
            </tr>
          ))}
          {list && list.length === 0 ? (
            <tr>
              <td colSpan={6} className="py-4 text-ink-faint">
                No drills yet. Start one with New drill.
              </td>
            </tr>
          ) : null}
          {!list && !error ? (
            <tr>
              <td colSpan={6} className="py-4 text-ink-faint">
                Loading drills…
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
