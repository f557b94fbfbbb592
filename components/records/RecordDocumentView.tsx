import type { ReactNode } from "react";
import type { RecordDetail } from "@/app/_lib/records/record-queries";
import {
  marginFigures,
  modelFigures,
  plantFigures,
  powerCurveRows,
  relayFigures,
  SAFETY_CAUTION,
  tuningFigures,
} from "@/app/_lib/records/record-figures";
import { TableHead } from "@/components/tables/TableHead";
import { FigureList } from "./FigureList";
import { ProofTestSection } from "./ProofTestSection";
import { RecordSection } from "./RecordSection";

const isoDate = (d: Date) => d.toISOString().slice(0, 10);

/**
 * The record as a document, in the order of its PDF: caution, plant, model, tuning, margins,
 * reported tests, notes, versions, each proof test, then the sign-off. The owner's forms come in as
 * slots so this stays a server component that anyone in the organisation can read.
 */
export function RecordDocumentView({ detail, notesSlot, signOffSlot }: { detail: RecordDetail; notesSlot?: ReactNode; signOffSlot?: ReactNode }) {
  const doc = detail.document;
  return (
    <article className="max-w-4xl space-y-6" data-record-document>
      <div className="space-y-1">
        <p className="text-xs uppercase tracking-wide text-ink-faint">Tuning record</p>
        <h1 className="text-xl font-semibold">{detail.title}</h1>
        <p className="text-sm text-ink-soft">
          Written by {detail.authorName} on <span className="num">{isoDate(detail.createdAt)}</span> · engine <span className="num">{doc.engineVersion}</span> · tuning set “{doc.tuningSetName}”
        </p>
      </div>

      <p role="note" className="rounded-sm border border-caution/50 bg-caution-soft px-3 py-2 text-sm text-caution">
        {SAFETY_CAUTION}
      </p>

      <RecordSection title="Plant">
        <FigureList figures={plantFigures(doc)} testId="record-plant" />
      </RecordSection>
      <RecordSection title="Model">
        <FigureList figures={modelFigures(doc)} />
      </RecordSection>
      <RecordSection title="Tuning">
        <FigureList figures={tuningFigures(doc.controller, doc.drive)} testId="record-tuning" />
      </RecordSection>
      <RecordSection title="Robustness margins (on the model)">
        <FigureList figures={marginFigures(doc)} testId="record-margins" />
        {(doc.margins?.messages ?? []).map((m, i) => (
          <p key={i} className="text-sm text-ink-soft">
            {m}
          </p>
        ))}
      </RecordSection>
      {doc.powerCurve ? (
        <RecordSection title="Power curve (reported by the flow)">
          <table className="w-full max-w-md text-sm">
            <TableHead columns={["OUT", "Steady temperature"]} />
            <tbody>
              {powerCurveRows(doc).map(([out, temp], i) => (
                <tr key={i} className="border-b border-rule">
                  <td className="num py-1">{out}</td>
                  <td className="num py-1">{temp}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </RecordSection>
      ) : null}
      {doc.relay ? (
        <RecordSection title="Relay test (reported by the flow)">
          <FigureList figures={relayFigures(doc)} />
        </RecordSection>
      ) : null}

      <RecordSection title="Notes">
        {notesSlot ?? <p className="whitespace-pre-wrap text-sm">{detail.notes || "No notes."}</p>}
      </RecordSection>

      <RecordSection title="Versions">
        <FigureList
          figures={[
            { key: "engine", label: "Engine", value: doc.engineVersion },
            { key: "record", label: "Record", value: `${detail.id}, last changed ${isoDate(detail.updatedAt)}` },
          ]}
        />
      </RecordSection>

      {doc.proofTests.length === 0 ? (
        <RecordSection title="Proof tests">
          <p className="text-sm text-ink-soft">No proof test is part of this record.</p>
        </RecordSection>
      ) : (
        <div className="space-y-8">
          <h2 className="border-b border-rule pb-1 text-sm font-semibold uppercase tracking-wide text-ink-soft">Proof tests</h2>
          {doc.proofTests.map((t, i) => (
            <ProofTestSection key={i} test={t} index={i} />
          ))}
        </div>
      )}

      <section className="record-signoff break-inside-avoid space-y-2 rounded-sm border border-rule-strong p-4" aria-labelledby="signoff-heading">
        <h2 id="signoff-heading" className="text-sm font-semibold uppercase tracking-wide text-ink-soft">
          Sign-off
        </h2>
        {detail.signedOffBy && detail.signedOffOn ? (
          <p className="text-sm" data-testid="record-signed-off">
            Signed off by <strong>{detail.signedOffBy}</strong> on <span className="num">{detail.signedOffOn}</span>. The record is frozen.
          </p>
        ) : (
          <>
            <p className="text-sm">Not signed off.</p>
            {signOffSlot}
            <dl className="hidden space-y-6 pt-4 text-sm print:block">
              {["Name", "Date", "Signature"].map((l) => (
                <div key={l} className="flex items-end gap-3">
                  <dt className="w-24">{l}</dt>
                  <dd className="h-6 w-80 border-b border-black" />
                </div>
              ))}
            </dl>
          </>
        )}
      </section>
    </article>
  );
}
