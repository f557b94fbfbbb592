/**
 * One pipeline from a log's text to its identification: read it through the mapping
 * (sim/import importLog), then fit FOPDT and SOPDT to the mapped record (sim/tuning/identify).
 * Pure, so the server (acceptTwin, reidentify) and the new-twin page's worker run the very same
 * code; the server runs it again on the uploaded bytes and never takes the browser's fit.
 */
import { importLog, type LogMapping, type LogSummary, type MappedLog } from "@/sim/import";
import { identifyStepResponse, type Identification } from "@/sim/tuning/identify";
import { blockFitNote, onFullRecord, reduceForFit } from "./fit-record";

export type LogIdentification =
  | {
      ok: true;
      log: MappedLog;
      summary: LogSummary;
      identification: Identification;
      /** how the fit was made when the log was too long to fit row by row (fit-record.ts); null otherwise */
      fitNote: string | null;
    }
  | { ok: false; stage: "read" | "identify"; code: string; message: string };

/** The engine's refusals are lower-case clauses ("no step in OUT: …"); shown to people as sentences. */
export function asSentence(message: string): string {
  const m = message.trim();
  if (!m) return "The log could not be read.";
  const s = m[0].toUpperCase() + m.slice(1);
  return /[.!?]$/.test(s) ? s : `${s}.`;
}

export function identifyLog(text: string, byteSize: number, mapping: LogMapping): LogIdentification {
  const read = importLog(text, byteSize, mapping);
  if (!read.ok) return { ok: false, stage: "read", code: read.code, message: asSentence(read.message) };
  const full = { t: read.log.t, out: read.log.out, pv: read.log.pv };
  const { record, blockSize } = reduceForFit(full);
  const fitted = identifyStepResponse(record);
  if (!fitted.ok) return { ok: false, stage: "identify", code: fitted.code, message: asSentence(fitted.message) };
  const identification = onFullRecord(fitted, full, blockSize);
  const fitNote = blockSize > 1 ? asSentence(blockFitNote(full.t.length, blockSize, identification.samples.medianIntervalS)) : null;
  return { ok: true, log: read.log, summary: read.summary, identification, fitNote };
}
