import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { guardPage } from "@/app/_lib/guard";
import { recordDetail } from "@/app/_lib/records/record-queries";
import { PrintButton } from "@/components/records/PrintButton";
import { RecordDocumentView } from "@/components/records/RecordDocumentView";
import { RecordNotesForm } from "@/components/records/RecordNotesForm";
import { SignOffForm } from "@/components/records/SignOffForm";
import "@/components/records/record-print.css";
import { signOffTuningRecord, updateTuningRecord } from "../actions";

export const metadata: Metadata = { title: "Tuning record" };

export default async function RecordPage({ params }: { params: Promise<{ recordId: string }> }) {
  const { recordId } = await params;
  const user = await guardPage();
  const detail = await recordDetail(user, recordId);
  if (!detail) notFound();
  const editable = detail.isOwner && !detail.signedOffBy;
  const today = new Date().toISOString().slice(0, 10);
  const link = "rounded-sm border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm no-underline hover:border-ink";
  return (
    <div className="space-y-4">
      <nav className="flex flex-wrap items-center gap-2 print:hidden" aria-label="Record">
        <a href="/records" className="mr-auto text-sm">
          ← All records
        </a>
        <a href={`/api/records/${detail.id}/pdf`} className={link}>
          Download PDF
        </a>
        <a href={`/api/records/${detail.id}/traces`} className={link}>
          Download traces (CSV)
        </a>
        <PrintButton />
      </nav>
      {!detail.isOwner ? <p className="text-sm text-ink-soft print:hidden">Read-only: only {detail.authorName} edits and signs off this record.</p> : null}
      <RecordDocumentView
        detail={detail}
        notesSlot={
          editable ? (
            <>
              <p className="hidden whitespace-pre-wrap text-sm print:block">{detail.notes || "No notes."}</p>
              <RecordNotesForm recordId={detail.id} title={detail.title} notes={detail.notes} action={updateTuningRecord} />
            </>
          ) : undefined
        }
        signOffSlot={editable ? <SignOffForm recordId={detail.id} today={today} suggestedName={user.displayName} action={signOffTuningRecord} /> : undefined}
      />
    </div>
  );
}
