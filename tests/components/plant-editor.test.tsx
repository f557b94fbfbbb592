// Component test (Testing Library in jsdom) of the plant editor: live validation with the
// engine's zod schema, derived figures recomputed with the engine's functions as one types, every
// figure carrying its unit, and a save that posts one JSON payload to the server action.
// Expected directions are physics of a heated enclosure (more heater power → higher steady
// temperature at the same OUT; common practice), the numbers themselves come from sim/.
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import type { ActionResult } from "@/app/_lib/action";
import { derivedFigures } from "@/sim/plant/derived-figures";
import { PLANT_PRESETS } from "@/sim/plant/presets";

const savePlant = vi.fn(async (_prev: ActionResult, _form: FormData): Promise<ActionResult> => ({ ok: true, message: "Plant saved.", id: "0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11", ref: "plant:0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11" }) as ActionResult);
const updatePlant = vi.fn(async (): Promise<ActionResult> => ({ ok: true }));
vi.mock("@/app/(app)/bench/actions", () => ({ savePlant: (p: ActionResult, f: FormData) => savePlant(p, f), updatePlant: () => updatePlant() }));

const { PlantEditor } = await import("@/components/bench/plants/PlantEditor");

const field = (label: string) => screen.getByLabelText(label) as HTMLInputElement;
const type = (label: string, value: string) => fireEvent.change(field(label), { target: { value } });
const figure = (testId: string) => screen.getByTestId(testId).textContent ?? "";
const numberIn = (text: string) => Number(text.replace(/[^\d.−-]/g, "").replace("−", "-"));

beforeEach(() => {
  savePlant.mockClear();
});

describe("PlantEditor", () => {
  it("shows the engine's derived figures of the starting plant, every number with its unit", () => {
    render(<PlantEditor />);
    const expected = derivedFigures(PLANT_PRESETS[0].plant, 50);
    expect(numberIn(figure("figure-gain"))).toBeCloseTo(expected.staticGainCPerPercent, 2);
    expect(numberIn(figure("figure-steady-state"))).toBeCloseTo(expected.steadyStateC, 0);
    const panel = screen.getByTestId("derived-figures");
    const readouts = panel.querySelectorAll(".num");
    expect(readouts.length).toBeGreaterThanOrEqual(9);
    for (const r of readouts) expect(r.textContent).toMatch(/^-?[\d,.]+\u00a0(°C\/%|°C|s|min)$/);
    // every input's unit sits beside it in the monospaced face
    expect(within(screen.getByRole("group", { name: "Heater" })).getAllByText("W")[0].className).toMatch(/\bnum\b/);
  });

  it("refuses an invalid value with a message and disables saving until it is corrected", async () => {
    render(<PlantEditor />);
    type("Plant name", "Cabinet K-7");
    const save = screen.getByRole("button", { name: "Save plant" }) as HTMLButtonElement;
    expect(save.disabled).toBe(false);

    type("Air volume", "-0.2");
    expect(screen.getByRole("alert").textContent).toBe("Must be more than 0.");
    expect(field("Air volume").getAttribute("aria-invalid")).toBe("true");
    expect(save.disabled).toBe(true);
    expect(screen.getByTestId("figures-unavailable")).toBeTruthy();

    type("Air volume", "0.2x");
    expect(screen.getByRole("alert").textContent).toBe("Enter a number.");

    type("Air volume", "0.2");
    // U includes both films: the engine's refinement reports on the U-value field
    type("Wall U-value", "9");
    expect(screen.getByRole("alert").textContent).toMatch(/1\/U must exceed 1\/h_inner \+ 1\/h_outer/);
    expect(save.disabled).toBe(true);
    type("Wall U-value", "0.8");
    expect(screen.queryByRole("alert")).toBeNull();
    expect(save.disabled).toBe(false);
  });

  it("updates the derived figures as one types", async () => {
    render(<PlantEditor />);
    const before = numberIn(figure("figure-steady-state"));
    type("Heater rating", "1600");
    await waitFor(() => expect(numberIn(figure("figure-steady-state"))).toBeGreaterThan(before + 5));
    const expected = derivedFigures({ ...PLANT_PRESETS[0].plant, heaterRatingW: 1600 }, 50);
    expect(numberIn(figure("figure-steady-state"))).toBeCloseTo(expected.steadyStateC, 0);

    // the steady state is read at the OUT the user chooses
    fireEvent.change(screen.getByLabelText("OUT for the steady state"), { target: { value: "20" } });
    await waitFor(() => expect(numberIn(figure("figure-steady-state"))).toBeCloseTo(derivedFigures({ ...PLANT_PRESETS[0].plant, heaterRatingW: 1600 }, 20).steadyStateC, 0));

    // a slower sensor makes the apparent dead time longer
    const deadBefore = numberIn(figure("figure-dead-time").split("s")[0]);
    type("Sensor element time constant", "120");
    await waitFor(() => expect(numberIn(figure("figure-dead-time").split("s")[0])).toBeGreaterThan(deadBefore));
  });

  it("offers a transfer-function model validated with the engine's schema", async () => {
    render(<PlantEditor />);
    fireEvent.click(screen.getByLabelText("Transfer function"));
    type("Static gain K", "0.9");
    type("Time constant τ₁", "0");
    expect(screen.getByRole("alert").textContent).toBe("Must be more than 0.");
    type("Time constant τ₁", "600");
    type("Dead time θ", "45");
    await waitFor(() => expect(numberIn(figure("figure-gain"))).toBeCloseTo(0.9, 2));
  });

  it("saves through the action with the validated definition in one JSON payload", async () => {
    const onSaved = vi.fn();
    render(<PlantEditor onSaved={onSaved} />);
    type("Plant name", "Cabinet K-7");
    type("Inlet airflow", "30");
    await act(async () => {
      fireEvent.click(screen.getByRole("button", { name: "Save plant" }));
    });
    await waitFor(() => expect(savePlant).toHaveBeenCalledTimes(1));
    const payload = JSON.parse(String(savePlant.mock.calls[0][1].get("payload")));
    expect(payload).toMatchObject({ name: "Cabinet K-7", origin: "physical", definition: { kind: "enclosure", inletAirflowM3PerH: 30, heaterRatingW: 800 } });
    await waitFor(() => expect(onSaved).toHaveBeenCalledWith("plant:0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11", expect.objectContaining({ inletAirflowM3PerH: 30 }), "Cabinet K-7"));
    expect((await screen.findByTestId("form-status")).textContent).toBe("Plant saved.");
  });
});
