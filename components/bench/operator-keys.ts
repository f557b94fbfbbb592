// The faceplate's keys, shared by the Bench and the attempt Bench: A toggles auto/manual, ↑↓ nudge
// the SP by 0.5 °C (or 1 °F), Shift+↑↓ nudge manual OUT by 1 %. Returns the operator action for
// the key, or null when the key is not one of them (or does nothing in the current mode).
import type { OperatorActionInput } from "@/sim/drill/actions";
import type { SampleSnapshot } from "@/sim/drill/simulation";
import type { TemperatureUnit } from "@/sim/units";

export function operatorKeyAction(e: Pick<KeyboardEvent, "key" | "shiftKey">, snap: Pick<SampleSnapshot, "mode" | "outPercent" | "setpointC">, unit: TemperatureUnit): OperatorActionInput | null {
  if (e.key === "a" || e.key === "A") return { type: "mode", mode: snap.mode === "auto" ? "manual" : "auto" };
  if (e.key !== "ArrowUp" && e.key !== "ArrowDown") return null;
  const dir = e.key === "ArrowUp" ? 1 : -1;
  if (e.shiftKey) return snap.mode === "manual" ? { type: "manual-output", outPercent: Math.min(100, Math.max(0, snap.outPercent + dir)) } : null;
  const stepC = unit === "C" ? 0.5 : 1 / 1.8;
  return { type: "setpoint", setpointC: Math.round((snap.setpointC + dir * stepC) * 1000) / 1000 };
}

export const isArrowKey = (key: string) => key === "ArrowUp" || key === "ArrowDown";
