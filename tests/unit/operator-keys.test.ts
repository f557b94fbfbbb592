// The faceplate keys (components/bench/operator-keys.ts): our own key map, documented in the
// Bench's keyboard help; 1 °F = 1/1.8 °C (definition of the Fahrenheit degree, common practice).
import { describe, expect, it } from "vitest";
import { operatorKeyAction } from "@/components/bench/operator-keys";

const auto = { mode: "auto" as const, outPercent: 40, setpointC: 60 };
const manual = { ...auto, mode: "manual" as const };

describe("operatorKeyAction", () => {
  it("A toggles the mode", () => {
    expect(operatorKeyAction({ key: "a", shiftKey: false }, auto, "C")).toEqual({ type: "mode", mode: "manual" });
    expect(operatorKeyAction({ key: "A", shiftKey: false }, manual, "C")).toEqual({ type: "mode", mode: "auto" });
  });
  it("arrows nudge the SP by 0.5 °C, or by 1 °F", () => {
    expect(operatorKeyAction({ key: "ArrowUp", shiftKey: false }, auto, "C")).toEqual({ type: "setpoint", setpointC: 60.5 });
    expect(operatorKeyAction({ key: "ArrowDown", shiftKey: false }, auto, "F")).toEqual({ type: "setpoint", setpointC: 59.444 });
  });
  it("Shift+arrows nudge OUT by 1 % in manual only, within 0–100 %", () => {
    expect(operatorKeyAction({ key: "ArrowUp", shiftKey: true }, manual, "C")).toEqual({ type: "manual-output", outPercent: 41 });
    expect(operatorKeyAction({ key: "ArrowUp", shiftKey: true }, auto, "C")).toBeNull();
    expect(operatorKeyAction({ key: "ArrowUp", shiftKey: true }, { ...manual, outPercent: 100 }, "C")).toEqual({ type: "manual-output", outPercent: 100 });
  });
  it("other keys are not faceplate keys", () => {
    expect(operatorKeyAction({ key: "x", shiftKey: false }, auto, "C")).toBeNull();
  });
});
