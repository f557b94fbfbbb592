/**
 * How an uploaded bump-test log is read: which column is what, how time is written, the decimal
 * mark and the temperature unit. Chosen by the technician on the Twins page (a guess is offered),
 * stored beside the raw file so the identification can be redone from the original.
 */
import { z } from "zod";

/** Largest upload accepted, bytes (2 MiB: a day of 1 s samples with five columns fits). */
export const MAX_UPLOAD_BYTES = 2 * 1024 * 1024;

/** Fewest rows accepted for identification (the fits have four and more free parameters). */
export const MIN_LOG_ROWS = 20;

const columnIndex = z.number().int().min(0).max(199);

export const logMappingSchema = z
  .object({
    /** cell separator; "auto" lets the parser find it */
    delimiter: z.enum(["auto", ",", ";", "\t"]).default("auto"),
    /** decimal mark of the numbers: "," for files written with a decimal comma */
    decimalMark: z.enum([".", ","]).default("."),
    /** the first non-comment line holds column names */
    headerRow: z.boolean().default(true),
    /** column positions, 0-based; SP and mode are optional */
    columns: z
      .object({
        time: columnIndex,
        out: columnIndex,
        pv: columnIndex,
        sp: columnIndex.nullable().default(null),
        mode: columnIndex.nullable().default(null),
      })
      .strict(),
    /** "seconds": elapsed seconds; "timestamp": absolute date-times (ISO 8601 or day.month.year) */
    timeFormat: z.enum(["seconds", "timestamp"]).default("seconds"),
    /** unit of the PV and SP columns; °F is converted to °C on reading */
    temperatureUnit: z.enum(["C", "F"]).default("C"),
  })
  .strict();

export type LogMapping = z.output<typeof logMappingSchema>;
export type LogMappingInput = z.input<typeof logMappingSchema>;

/** A log read through its mapping: time in s from the first row, OUT in %, PV and SP in °C. */
export interface MappedLog {
  t: number[];
  out: number[];
  pv: number[];
  sp: number[] | null;
  /** "auto" | "manual" per row when a mode column is mapped (other words are kept as written) */
  mode: string[] | null;
  /** ISO 8601 time of the first row when time is absolute */
  startedAt: string | null;
}

export type ImportRefusalCode =
  | "empty"
  | "too-large"
  | "unreadable"
  | "bad-mapping"
  | "non-numeric"
  | "bad-timestamp"
  | "time-not-increasing"
  | "too-few-points"
  | "no-step"
  | "pv-flat";

export interface ImportRefusal {
  ok: false;
  code: ImportRefusalCode;
  /** a sentence the technician can act on, naming the line and column where there is one */
  message: string;
}
