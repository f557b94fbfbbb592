/**
 * Converts a rule's tuning to one of the controller block's forms (sim/control/config.ts).
 * Conversions as in Åström & Hägglund 1995, §3.2 (sim/control/forms.ts):
 *   series → standard: Kc' = Kc(1 + Td/Ti), Ti' = Ti + Td, Td' = TiTd/(Ti + Td);
 *   standard → series exists only with real zeros, Ti ≥ 4·Td;
 *   standard → parallel: Kp = Kc, Ki = Kc/Ti, Kd = Kc·Td.
 */
import { idealToParallel, idealToSeries, seriesToIdeal } from "../../control/forms";
import type { Tuning } from "./tuning";

export type BlockForm = "standard" | "parallel" | "series";

/** The fields of the block's configuration that carry a tuning (ti = 0: no integral action). */
export interface BlockTuning {
  form: BlockForm;
  kc: number;
  ti: number;
  td: number;
  ki: number;
  kd: number;
  /** suggested PV filter time constant (from an IMC "PID + lag"), s; absent if the rule has none */
  pvFilterTauS?: number;
}

export type FormConversion =
  | { ok: true; tuning: BlockTuning }
  | { ok: false; form: BlockForm; reason: string };

export function toBlockForm(t: Tuning, form: BlockForm): FormConversion {
  const ideal = t.form === "series" ? seriesToIdeal(t.kc, t.tiS, t.tdS) : { kc: t.kc, ti: t.tiS, td: t.tdS };
  const extra = t.filterTauS !== undefined ? { pvFilterTauS: t.filterTauS } : {};
  switch (form) {
    case "standard":
      return { ok: true, tuning: { form, kc: ideal.kc, ti: ideal.ti, td: ideal.td, ki: 0, kd: 0, ...extra } };
    case "parallel": {
      const p = idealToParallel(ideal.kc, ideal.ti, ideal.td);
      return { ok: true, tuning: { form, kc: p.kp, ti: 0, td: 0, ki: p.ki, kd: p.kd, ...extra } };
    }
    case "series": {
      if (t.form === "series") return { ok: true, tuning: { form, kc: t.kc, ti: t.tiS, td: t.tdS, ki: 0, kd: 0, ...extra } };
      const s = idealToSeries(ideal.kc, ideal.ti, ideal.td);
      if (!s)
        return {
          ok: false,
          form,
          reason: `not representable in the series form: Ti = ${fmt(ideal.ti)} s is less than 4·Td = ${fmt(4 * ideal.td)} s, so this PID has complex zeros, which a series (interacting) controller cannot produce; use the standard or parallel form`,
        };
      return { ok: true, tuning: { form, kc: s.kc, ti: s.ti, td: s.td, ki: 0, kd: 0, ...extra } };
    }
  }
}

function fmt(x: number): string {
  return String(+x.toPrecision(4));
}
