// Faceplate behaviour: readouts with units, SP nudges by arrow keys, manual OUT only in manual,
// alarm states and the cutout reset (NFPA 86: manual reset of the excess-temperature limit —
// references §14, clause from memory).
import { fireEvent, render, screen } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { Faceplate } from "@/components/bench/Faceplate";
import type { SampleSnapshot } from "@/sim/drill/simulation";

const snap = (patch: Partial<SampleSnapshot> = {}): SampleSnapshot => ({
  sample: 10,
  timeS: 5,
  setpointC: 60,
  pvRawC: 59.8,
  pvFilteredC: 59.9,
  trueC: 60,
  outPercent: 25,
  mode: "auto",
  pvBad: false,
  cutoutTripped: false,
  ...patch,
});

const handlers = () => ({ onSetpoint: vi.fn(), onMode: vi.fn(), onManualOutput: vi.fn(), onCutoutReset: vi.fn() });

describe("Faceplate", () => {
  it("shows PV in the chosen unit and nudges SP with the arrow keys", () => {
    const h = handlers();
    render(<Faceplate snapshot={snap()} unit="F" highAlarmC={140} {...h} />);
    expect(screen.getByTestId("pv-readout").textContent).toBe("139.8"); // 59.9 °C
    fireEvent.keyDown(screen.getByTestId("sp-input"), { key: "ArrowUp" });
    expect(h.onSetpoint).toHaveBeenCalledTimes(1);
    expect(h.onSetpoint.mock.calls[0][0]).toBeCloseTo((141 - 32) / 1.8, 6); // 140 °F + 1 °F
  });

  it("allows manual OUT entry only in manual and clips it to 0–100 %", () => {
    const h = handlers();
    const { rerender } = render(<Faceplate snapshot={snap()} unit="C" highAlarmC={140} {...h} />);
    expect((screen.getByTestId("out-input") as HTMLInputElement).disabled).toBe(true);
    rerender(<Faceplate snapshot={snap({ mode: "manual" })} unit="C" highAlarmC={140} {...h} />);
    const out = screen.getByTestId("out-input");
    expect((out as HTMLInputElement).disabled).toBe(false);
    fireEvent.focus(out);
    fireEvent.change(out, { target: { value: "130" } });
    fireEvent.keyDown(out, { key: "Enter" });
    expect(h.onManualOutput).toHaveBeenCalledWith(100);
    fireEvent.click(screen.getByRole("button", { name: "Auto" }));
    expect(h.onMode).toHaveBeenCalledWith("auto");
  });

  it("shows bad PV, high PV and a tripped cutout with its manual reset", () => {
    const h = handlers();
    render(<Faceplate snapshot={snap({ pvBad: true, pvFilteredC: 150, cutoutTripped: true })} unit="C" highAlarmC={140} {...h} />);
    expect(screen.getByTestId("pv-readout").textContent).toBe("BAD");
    expect(screen.getByLabelText("Bad PV: active")).toBeTruthy();
    expect(screen.getByLabelText("High PV: active")).toBeTruthy();
    expect(screen.getByRole("alert").textContent).toMatch(/releases only on a manual reset/);
    fireEvent.click(screen.getByRole("button", { name: "Reset cutout" }));
    expect(h.onCutoutReset).toHaveBeenCalledTimes(1);
  });
});
