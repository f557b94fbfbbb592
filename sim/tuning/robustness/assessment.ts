/**
 * Plain-language reading of the margins for a technician. Thresholds (references §15, MEMORY for
 * the recommended ranges): Ms between about 1.2 and 2 is the usual robust range (Åström &
 * Hägglund; Skogestad & Postlethwaite give Ms < 2); classical targets GM 2–5 and PM 30–60°.
 */
import type { Margins } from "./margins";

export type Verdict = "unstable" | "fragile" | "acceptable" | "robust";

export interface RobustnessAssessment {
  verdict: Verdict;
  /** Ms > 2 */
  msAbove2: boolean;
  messages: string[];
}

function r(x: number, d = 3): string {
  return String(+x.toPrecision(d));
}

export function assessMargins(m: Margins): RobustnessAssessment {
  const messages: string[] = [];
  const unstable = m.gainMargin < 1 || m.phaseMarginDeg < 0 || Number.isNaN(m.phaseMarginDeg);
  if (unstable) {
    messages.push(
      "The closed loop is unstable with this tuning: it will oscillate with growing amplitude. Lower Kc (and lengthen Ti) until the gain margin is above 2.",
    );
    return { verdict: "unstable", msAbove2: true, messages };
  }
  const msAbove2 = m.maxSensitivity > 2;
  if (msAbove2) {
    const gainRoom = Number.isFinite(m.gainMargin) ? `the process gain only has to rise by a factor ${r(m.gainMargin)} ` : "";
    const delayRoom = Number.isFinite(m.delayMarginS) ? `${gainRoom ? "or " : ""}the dead time grow by ${r(m.delayMarginS)} s ` : "";
    const room = `${gainRoom}${delayRoom}`;
    messages.push(
      `Ms = ${r(m.maxSensitivity)} is above 2: the loop runs close to its stability limit. ` +
        (room ? `${room.charAt(0).toUpperCase()}${room.slice(1)}for it to oscillate without dying out. ` : "") +
        "Expect overshoot and ringing after every setpoint change or disturbance, and noise on OUT. " +
        "Lower Kc or lengthen Ti (or shorten Td) to bring Ms below 2; 1.4–1.6 is a comfortable target.",
    );
  }
  const lowGm = Number.isFinite(m.gainMargin) && m.gainMargin < 2;
  const lowPm = Number.isFinite(m.phaseMarginDeg) && m.phaseMarginDeg < 30;
  if (lowGm) messages.push(`Gain margin ${r(m.gainMargin)} is below 2 (6 dB): a doubling of the process gain would make the loop oscillate.`);
  if (lowPm) messages.push(`Phase margin ${r(m.phaseMarginDeg)}° is below 30°: expect a lightly damped, ringing response.`);
  const robust = m.maxSensitivity <= 1.6;
  if (!messages.length) messages.push(`Ms = ${r(m.maxSensitivity)}: ${robust ? "a robust tuning" : "an acceptable tuning"} with room for model error.`);
  return { verdict: msAbove2 || lowGm || lowPm ? "fragile" : robust ? "robust" : "acceptable", msAbove2, messages };
}
