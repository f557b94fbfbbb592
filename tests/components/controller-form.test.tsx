// The controller form in the user's units. Conversions checked against their definitions:
// °F = °C·9/5 + 32 for absolute temperatures, ×9/5 for differences (NIST SP 811, Appendix B.8,
// from memory); repeats per minute = 60/Ti[s] and PB = 100 %/(Kc·span/100 %) (common practice).
import { fireEvent, render, screen } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { controllerConfigSchema } from "@/sim/control/config";
import { ControllerForm } from "@/components/bench/ControllerForm";
import { fromFormValues, toFormValues } from "@/components/bench/controller-units";
import type { DisplayUnits } from "@/components/bench/store";

const cfg = controllerConfigSchema.parse({ kc: 4, ti: 240, td: 30, deadbandC: 0.5, hysteresisC: 2, pvFilterTauS: 2, sampleTimeS: 0.5 });
const SPAN = 200;
const all: DisplayUnits[] = [];
for (const temperature of ["C", "F"] as const)
  for (const gain of ["kc", "pb"] as const)
    for (const integral of ["s", "min", "repeats/min"] as const) for (const derivative of ["s", "min"] as const) all.push({ temperature, gain, integral, derivative });

describe("controller form conversions", () => {
  it("round-trip every unit preference back to the same canonical configuration", () => {
    for (const u of all) {
      const back = fromFormValues(toFormValues(cfg, u, SPAN), u, SPAN);
      expect(back.ok, JSON.stringify(u)).toBe(true);
      if (!back.ok) continue;
      for (const k of ["kc", "ti", "td", "deadbandC", "hysteresisC", "pvFilterTauS"] as const) expect(back.config[k]).toBeCloseTo(cfg[k], 4);
    }
  });

  it("shows differences as differences and absolute-free quantities in the chosen units", () => {
    const f = toFormValues(cfg, { temperature: "F", gain: "pb", integral: "repeats/min", derivative: "min" }, SPAN);
    expect(Number(f.deadbandC)).toBeCloseTo(0.9, 9); // 0.5 °C difference = 0.9 °F, not 32.9 °F
    expect(Number(f.hysteresisC)).toBeCloseTo(3.6, 9);
    expect(Number(f.kc)).toBeCloseTo(12.5, 9); // PB = 10⁴/(4 %/°C · 200 °C)
    expect(Number(f.ti)).toBeCloseTo(0.25, 9); // 60/240 s
    expect(Number(f.td)).toBeCloseTo(0.5, 9); // 30 s
    const perF = toFormValues(cfg, { temperature: "F", gain: "kc", integral: "s", derivative: "s" }, SPAN);
    expect(Number(perF.kc)).toBeCloseTo(4 / 1.8, 4); // % per °F
  });

  it("refuses text and a zero proportional band with a message per field", () => {
    const u: DisplayUnits = { temperature: "C", gain: "pb", integral: "s", derivative: "s" };
    const bad = { ...toFormValues(cfg, u, SPAN), kc: "0", ti: "abc" };
    const r = fromFormValues(bad, u, SPAN);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.kc).toMatch(/proportional band/);
      expect(r.errors.ti).toBe("Enter a number.");
    }
  });
});

describe("ControllerForm", () => {
  const units: DisplayUnits = { temperature: "C", gain: "kc", integral: "s", derivative: "s" };

  it("applies a valid change bumplessly and keeps the canonical units", () => {
    const onApply = vi.fn();
    render(<ControllerForm config={cfg} units={units} spanC={SPAN} onUnits={() => {}} onApply={onApply} onRestart={() => {}} />);
    fireEvent.change(screen.getByLabelText("Gain Kc"), { target: { value: "6" } });
    fireEvent.click(screen.getByRole("button", { name: "Apply tuning (bumpless)" }));
    expect(onApply).toHaveBeenCalledTimes(1);
    expect(onApply.mock.calls[0][0].kc).toBe(6);
    expect(screen.getByRole("status").textContent).toMatch(/bumplessly/);
  });

  it("restarts instead when the sample time changes, and shows field errors without applying", () => {
    const onApply = vi.fn();
    const onRestart = vi.fn();
    render(<ControllerForm config={cfg} units={units} spanC={SPAN} onUnits={() => {}} onApply={onApply} onRestart={onRestart} />);
    fireEvent.change(screen.getByLabelText("Sample time"), { target: { value: "1" } });
    fireEvent.click(screen.getByRole("button", { name: "Apply tuning (bumpless)" }));
    expect(onRestart).toHaveBeenCalledTimes(1);
    fireEvent.change(screen.getByLabelText("OUT high limit"), { target: { value: "-5" } });
    fireEvent.click(screen.getByRole("button", { name: "Apply tuning (bumpless)" }));
    expect(screen.getByText("outMaxPct must exceed outMinPct")).toBeTruthy();
    expect(onApply).not.toHaveBeenCalled();
  });
});
