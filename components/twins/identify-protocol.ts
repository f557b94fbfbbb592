/** Messages between the new-twin page and its identification worker (identify.worker.ts). */
import type { LogMapping, LogSummary } from "@/sim/import";
import type { Identification } from "@/sim/tuning/identify";

export interface IdentifyRequest {
  id: number;
  text: string;
  byteSize: number;
  mapping: LogMapping;
}

/** The log itself stays on the page (it read the same text with the same mapping for the preview). */
export type IdentifyReply =
  | { id: number; ok: true; identification: Identification; summary: LogSummary; fitNote: string | null; elapsedMs: number }
  | { id: number; ok: false; message: string; elapsedMs: number };
