// The new-twin page's mapping step: the file is read again on every change of the mapping, and a
// refusal is shown in words beside the form. uPlot is replaced by a stub (jsdom has no canvas).
// The log is a synthetic FOPDT bump test (step response y0 + KΔu(1 − e^{−(t−t0−θ)/τ}), the
// textbook FOPDT form — Seborg et al., Process Dynamics and Control, from memory).
import { fireEvent, render, screen, within } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";

vi.mock("uplot", () => ({ default: class { static sync = () => ({ key: "k" }); destroy() {} } }));

import { MappingStep } from "@/components/twins/MappingStep";
import { guessMappingForText } from "@/sim/import";

function log(decimal: "." | ",", sep: string): string {
  const lines = [["time_s", "out_pct", "pv_degC", "sp_degC"].join(sep)];
  for (let i = 0; i < 120; i++) {
    const t = i * 5;
    const out = t >= 60 ? 45 : 25;
    const d = t - 60 - 20;
    const pv = 40 + (d > 0 ? 0.5 * 20 * (1 - Math.exp(-d / 120)) : 0) + 0.01 * ((i * 7) % 5);
    const f = (x: number, digits: number) => x.toFixed(digits).replace(".", decimal);
    lines.push([String(t), f(out, 1), f(pv, 2), f(55, 1)].join(sep));
  }
  return lines.join("\n") + "\n";
}

function setup(text: string) {
  const guess = guessMappingForText(text);
  if (!guess.ok) throw new Error(guess.message);
  const onReading = vi.fn();
  render(<MappingStep text={text} byteSize={text.length} fileName="oven.csv" initialMapping={guess.mapping} onReading={onReading} />);
  return { onReading, mapping: guess.mapping };
}

describe("MappingStep", () => {
  it("pre-fills the guessed mapping, shows the header names, the first rows and that the log reads", () => {
    const { onReading } = setup(log(".", ","));
    expect(screen.getByTestId("mapping-ok")).toBeTruthy();
    expect((screen.getByLabelText("Time column") as HTMLSelectElement).value).toBe("0");
    expect((screen.getByLabelText("PV column") as HTMLSelectElement).value).toBe("2");
    expect(within(screen.getByLabelText("OUT column (%)")).getByRole("option", { name: "2: out_pct" })).toBeTruthy();
    expect(within(screen.getByTestId("log-preview-table")).getAllByRole("row")).toHaveLength(1 + 1 + 8); // head, "read as", 8 rows
    expect(screen.getByTestId("sampling-facts").textContent).toContain("120");
    expect(onReading.mock.lastCall?.[1].refusal).toBeNull();
  });

  it("changing the decimal mark re-reads the file and shows the refusal; changing it back reads again", () => {
    const { onReading } = setup(log(".", ","));
    fireEvent.change(screen.getByLabelText("Decimal mark"), { target: { value: "," } });
    const alert = screen.getByTestId("mapping-refusal");
    // the importer's message names the line, the column and the cell (sim/import map-log)
    expect(alert.textContent).toMatch(/^Line 2, column "out_pct": "25\.0" is not a number/);
    expect(alert.textContent).toContain("Nothing has been saved");
    expect(onReading.mock.lastCall?.[0].decimalMark).toBe(",");
    expect(onReading.mock.lastCall?.[1].refusal).toMatch(/not a number/);
    fireEvent.change(screen.getByLabelText("Decimal mark"), { target: { value: "." } });
    expect(screen.queryByTestId("mapping-refusal")).toBeNull();
    expect(screen.getByTestId("mapping-ok")).toBeTruthy();
  });

  it("changing a column re-reads the file: OUT on the SP column has no step", () => {
    setup(log(".", ","));
    fireEvent.change(screen.getByLabelText("OUT column (%)"), { target: { value: "3" } });
    expect(screen.getByTestId("mapping-refusal").textContent).toMatch(/^No step in OUT/);
    fireEvent.change(screen.getByLabelText("Time column"), { target: { value: "1" } });
    expect(screen.getByTestId("mapping-refusal").textContent).toMatch(/time does not increase/);
  });

  it("reads a decimal-comma, semicolon file once the guess says so, and refuses it read with a comma delimiter", () => {
    setup(log(",", ";"));
    expect(screen.getByTestId("mapping-ok")).toBeTruthy();
    expect((screen.getByLabelText("Decimal mark") as HTMLSelectElement).value).toBe(",");
    fireEvent.change(screen.getByLabelText("Delimiter"), { target: { value: "," } });
    expect(screen.getByTestId("mapping-refusal")).toBeTruthy();
  });
});
