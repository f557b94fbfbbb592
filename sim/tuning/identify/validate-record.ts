/** Checks a raw record before anything is computed from it; every failure is a refusal with a message. */
import { MIN_POINTS, refusal, type IdentifyRefusal, type StepRecord } from "./step-record";

function isNumberArray(x: unknown): x is readonly unknown[] {
  return Array.isArray(x) || ArrayBuffer.isView(x);
}

export function validateRecord(raw: unknown): { ok: true; record: StepRecord } | IdentifyRefusal {
  if (typeof raw !== "object" || raw === null) return refusal("not-arrays", "the record must have three columns: time, OUT and PV");
  const r = raw as Record<string, unknown>;
  const cols = { time: r.t, OUT: r.out, PV: r.pv };
  for (const [name, c] of Object.entries(cols)) if (!isNumberArray(c)) return refusal("not-arrays", `the ${name} column is missing or not a list of numbers`);
  const t = Array.from(r.t as ArrayLike<unknown>);
  const out = Array.from(r.out as ArrayLike<unknown>);
  const pv = Array.from(r.pv as ArrayLike<unknown>);
  if (t.length !== out.length || t.length !== pv.length)
    return refusal("length-mismatch", `the columns have different lengths (time ${t.length}, OUT ${out.length}, PV ${pv.length})`);
  if (t.length < MIN_POINTS) return refusal("too-few-points", `too few points: ${t.length} (at least ${MIN_POINTS} are needed, and a good record has hundreds)`);
  for (let i = 0; i < t.length; i++) {
    for (const [name, c] of [["time", t], ["OUT", out], ["PV", pv]] as const) {
      const v = c[i];
      if (typeof v !== "number" || !Number.isFinite(v)) return refusal("not-finite", `row ${i + 1}: ${name} is not a finite number (${String(v)})`);
    }
    if (i > 0 && !((t[i] as number) > (t[i - 1] as number)))
      return refusal("time-not-increasing", `row ${i + 1}: time ${t[i]} s does not increase (previous ${t[i - 1]} s); sort the rows and remove duplicates`);
  }
  return { ok: true, record: { t: t as number[], out: out as number[], pv: pv as number[] } };
}
