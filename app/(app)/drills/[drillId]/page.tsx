import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { guardPage } from "@/app/_lib/guard";
import { DrillBuilder } from "@/components/drills/DrillBuilder";
import { drillFor, drillVersionFor } from "@/db/drill-queries";
import { archiveDrill, duplicateDrill, newDraftFromPublished, publishDraft, saveDraft, setDrillShared } from "../actions";

export const metadata: Metadata = { title: "Drill builder" };

export default async function DrillPage({ params, searchParams }: { params: Promise<{ drillId: string }>; searchParams: Promise<{ version?: string }> }) {
  const { drillId } = await params;
  const { version } = await searchParams;
  const user = await guardPage({ roles: ["instructor", "admin"] });
  const drill = await drillFor(user, drillId);
  if (!drill) notFound();
  const asked = version && /^[1-9][0-9]{0,8}$/.test(version) ? Number(version) : undefined;
  // default: the latest version (the open draft, when there is one: it is always the newest)
  const current = (asked !== undefined ? await drillVersionFor(user, drillId, asked) : null) ?? (await drillVersionFor(user, drillId));
  if (!current) notFound();
  return (
    <DrillBuilder
      key={current.drillId}
      drill={drill}
      current={current}
      actions={{ saveDraft, publishDraft, newDraftFromPublished, duplicateDrill, setDrillShared, archiveDrill }}
    />
  );
}
