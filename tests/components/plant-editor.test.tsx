// Component test (Testing Library in jsdom) of the plant editor: live validation with the
// engine's zod schema, derived figures recomputed with the engine's functions as one types, every
// figure carrying its unit, and a save that posts one JSON payload to the server action.
// Expected directions are physics of a heated enclosure (more heater power → higher steady
// temperature at the same OUT; common practice), the numbers themselves come from sim/.
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import type { ReactNode } from "react";
import { SWRConfig } from "swr";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { ActionResult } from "@/app/_lib/action";
import type { PlantListItem, SavedRunSummary, TuningSetItem } from "@/db/bench-queries";
import { controllerConfigSchema } from "@/sim/control/config";
import { ENGINE_VERSION } from "@/sim/version";
import { derivedFigures } from "@/sim/plant/derived-figures";
import { PLANT_PRESETS } from "@/sim/plant/presets";

const savePlant = vi.fn(async (_prev: ActionResult, _form: FormData): Promise<ActionResult> => ({ ok: true, message: "Plant saved.", id: "0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11", ref: "plant:0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11" }) as ActionResult);
const updatePlant = vi.fn(async (_prev: ActionResult, _form: FormData): Promise<ActionResult> => ({ ok: true, message: "Plant updated." }));
const saveTuningSet = vi.fn(async (_prev: ActionResult, _form: FormData): Promise<ActionResult> => ({ ok: true, message: "Tuning set saved." }));
const saveRun = vi.fn(async (_prev: ActionResult, _form: FormData): Promise<ActionResult> => ({ ok: true, message: "Run saved." }));
const setPlantShared = vi.fn(async (_prev: ActionResult, _form: FormData): Promise<ActionResult> => ({ ok: true, message: "Plant shared within your organisation." }));
const refused = async (): Promise<ActionResult> => ({ ok: false, error: "You are not allowed to do that." });
vi.mock("@/app/(app)/bench/actions", () => ({
  savePlant: (p: ActionResult, f: FormData) => savePlant(p, f),
  updatePlant: (p: ActionResult, f: FormData) => updatePlant(p, f),
  saveTuningSet: (p: ActionResult, f: FormData) => saveTuningSet(p, f),
  deleteTuningSet: refused,
  saveRun: (p: ActionResult, f: FormData) => saveRun(p, f),
  deleteRun: refused,
  setPlantShared: (p: ActionResult, f: FormData) => setPlantShared(p, f),
  deletePlant: refused,
}));

const { PlantEditor } = await import("@/components/bench/plants/PlantEditor");
const { PlantPicker } = await import("@/components/bench/plants/PlantPicker");
const { TuningSets } = await import("@/components/bench/saved/TuningSets");
const { RunHistory } = await import("@/components/bench/saved/RunHistory");

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

    // a second save changes the plant just created instead of making a copy
    type("Inlet airflow", "35");
    await act(async () => {
      fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    });
    await waitFor(() => expect(updatePlant).toHaveBeenCalledTimes(1));
    expect(savePlant).toHaveBeenCalledTimes(1);
    expect(JSON.parse(String(updatePlant.mock.calls[0][1].get("payload")))).toMatchObject({ plantId: "0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11", definition: { inletAirflowM3PerH: 35 } });
  });
});

// ---- the saved-work panels beside the editor, against a stubbed route-handler API ----

const freshSwr = ({ children }: { children: ReactNode }) => <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>{children}</SWRConfig>;

function stubApi(routes: Record<string, unknown>) {
  const fetchMock = vi.fn(async (url: string) => {
    const body = routes[url];
    return new Response(JSON.stringify(body ?? { error: "No such thing." }), { status: body ? 200 : 404, headers: { "content-type": "application/json" } });
  });
  vi.stubGlobal("fetch", fetchMock);
  return fetchMock;
}

afterEach(() => vi.unstubAllGlobals());

const preset = PLANT_PRESETS[0];
const ownPlantId = "5f0c3b8e-2a41-4d7e-8f3a-6b1d9c0e7a21";
const plantItems: PlantListItem[] = [
  {
    ref: `preset:${preset.id}`,
    source: "preset",
    id: preset.id,
    title: preset.title,
    description: preset.description,
    kind: "enclosure",
    origin: "preset",
    shared: true,
    ownerName: null,
    updatedAt: null,
    definition: preset.plant,
    figures: { outPercent: 50, staticGainCPerPercent: 1.23, steadyStateC: 82.5, dominantTimeConstantS: 1800, apparentDeadTimeS: 95, timeTo63PercentS: 1900 },
  },
  {
    ref: `plant:${ownPlantId}`,
    source: "own",
    id: ownPlantId,
    title: "Cabinet K-7",
    description: "Bay 2",
    kind: "enclosure",
    origin: "physical",
    shared: false,
    ownerName: "Owner",
    updatedAt: "2026-11-30T10:00:00.000Z",
    definition: { ...preset.plant, heaterRatingW: 1500 },
    figures: null,
  },
];

describe("PlantPicker", () => {
  it("lists presets and the user's plants and hands over the chosen definition", async () => {
    stubApi({ "/api/plants": { plants: plantItems } });
    const onChange = vi.fn();
    render(<PlantPicker value={`preset:${preset.id}`} onChange={onChange} />, { wrapper: freshSwr });
    const select = (await screen.findByRole("combobox", { name: "Plant" })) as HTMLSelectElement;
    await waitFor(() => expect(select.value).toBe(`preset:${preset.id}`));
    expect(within(select).getByRole("group", { name: "Presets" })).toBeTruthy();
    expect(within(select).getByRole("group", { name: "My plants" })).toBeTruthy();
    expect(screen.getByTestId("plant-summary").textContent).toContain("1.23\u00a0°C/%");
    fireEvent.change(select, { target: { value: `plant:${ownPlantId}` } });
    expect(onChange).toHaveBeenCalledWith(`plant:${ownPlantId}`, expect.objectContaining({ heaterRatingW: 1500 }), "Cabinet K-7");
  });

  it("offers sharing to the owner of the chosen plant only", async () => {
    stubApi({ "/api/plants": { plants: plantItems } });
    const { rerender } = render(<PlantPicker value={`preset:${preset.id}`} onChange={() => {}} />, { wrapper: freshSwr });
    await screen.findByTestId("plant-summary");
    expect(screen.queryByRole("button", { name: /share in the organisation/ })).toBeNull();
    rerender(<PlantPicker value={`plant:${ownPlantId}`} onChange={() => {}} />);
    await act(async () => fireEvent.click(await screen.findByRole("button", { name: "Private · share in the organisation" })));
    await waitFor(() => expect(setPlantShared).toHaveBeenCalledTimes(1));
    const form = setPlantShared.mock.calls[0][1];
    expect([form.get("id"), form.get("shared")]).toEqual([ownPlantId, "true"]);
  });
});

describe("TuningSets", () => {
  const ref = `preset:${preset.id}`;
  const current = controllerConfigSchema.parse({ kc: 3.5, ti: 240, pvFilterTauS: 4 });
  const stored: TuningSetItem = { id: "9d3e2f1a-0b4c-4e5d-8a6f-7b8c9d0e1f2a", plantRef: ref, name: "Relay PI", notes: "", controller: controllerConfigSchema.parse({ kc: 5, ti: 300, td: 20 }), createdAt: "2026-11-30T10:00:00.000Z" };

  it("lists, loads and saves the current tuning under a name", async () => {
    stubApi({ [`/api/tuning-sets?plant=${encodeURIComponent(ref)}`]: { tuningSets: [stored] } });
    const onLoad = vi.fn();
    render(<TuningSets plantRef={ref} current={current} onLoad={onLoad} />, { wrapper: freshSwr });
    const row = await screen.findByTestId("tuning-set");
    expect(row.textContent).toContain("Kc 5\u00a0%/°C");
    expect(row.textContent).toContain("Td 20\u00a0s");
    fireEvent.click(within(row).getByRole("button", { name: "Load" }));
    expect(onLoad).toHaveBeenCalledWith(expect.objectContaining({ kc: 5, ti: 300, td: 20, form: "standard" }));

    const save = screen.getByRole("button", { name: "Save current tuning" }) as HTMLButtonElement;
    expect(save.disabled).toBe(true); // no name yet
    fireEvent.change(screen.getByLabelText("Tuning set name"), { target: { value: "Filter 4 s" } });
    await act(async () => fireEvent.click(save));
    await waitFor(() => expect(saveTuningSet).toHaveBeenCalledTimes(1));
    expect(JSON.parse(String(saveTuningSet.mock.calls[0][1].get("payload")))).toEqual({ plantRef: ref, name: "Filter 4 s", notes: "", controller: current });
  });
});

describe("RunHistory", () => {
  const ref = `preset:${preset.id}`;
  const summary = (id: string, title: string, iae: number | null): SavedRunSummary => ({
    id,
    plantRef: ref,
    title,
    createdAt: "2026-11-30T10:00:00.000Z",
    engineVersion: ENGINE_VERSION,
    durationS: 3600,
    seed: 7,
    actionCount: 3,
    keyResults: { iae, overshootPct: 1.5, settlingTimeS: 640, trips: 0 },
  });
  const ids = ["1a2b3c4d-0000-4000-8000-000000000001", "1a2b3c4d-0000-4000-8000-000000000002"];
  const full = (id: string) => ({ run: { id, plantRef: ref, title: id, createdAt: "2026-11-30T10:00:00.000Z", drill: {}, controller: {}, seed: 7, actionLog: [], results: {}, engineVersion: ENGINE_VERSION, durationS: 3600 } });

  it("shows key results with units, overlays ticked runs and saves the current run", async () => {
    const fetchMock = stubApi({
      [`/api/runs?plant=${encodeURIComponent(ref)}`]: { runs: [summary(ids[1], "PID, filter 2 s", 812.4), summary(ids[0], "PI", null)] },
      [`/api/runs/${ids[0]}`]: full(ids[0]),
      [`/api/runs/${ids[1]}`]: full(ids[1]),
    });
    const onCompare = vi.fn();
    const onOpen = vi.fn();
    const currentRun = { drill: { id: "bench" }, controller: controllerConfigSchema.parse({}), seed: 11, actionLog: [{ sample: 5, type: "setpoint", setpointC: 70 }], results: { wholeRun: {} }, engineVersion: ENGINE_VERSION, durationS: 900 };
    render(<RunHistory plantRef={ref} currentRun={currentRun} onOpen={onOpen} onCompare={onCompare} />, { wrapper: freshSwr });
    const rows = await screen.findAllByTestId("saved-run");
    expect(rows[0].textContent).toContain("812\u00a0°C·s");
    expect(rows[0].textContent).toContain("1.5\u00a0%");
    expect(rows[1].textContent).toContain("—\u00a0°C·s"); // missing result: a dash, still with its unit

    const overlay = screen.getByRole("button", { name: "Overlay ticked runs" }) as HTMLButtonElement;
    expect(overlay.disabled).toBe(true);
    fireEvent.click(screen.getByLabelText("Tick PI for comparison"));
    fireEvent.click(screen.getByLabelText("Tick PID, filter 2 s for comparison"));
    await act(async () => fireEvent.click(screen.getByRole("button", { name: "Overlay 2 runs" })));
    await waitFor(() => expect(onCompare).toHaveBeenCalledTimes(1));
    expect(onCompare.mock.calls[0][0].map((r: { id: string }) => r.id)).toEqual([ids[0], ids[1]]);

    await act(async () => fireEvent.click(within(rows[1]).getByRole("button", { name: "Open" })));
    await waitFor(() => expect(onOpen).toHaveBeenCalledWith(expect.objectContaining({ id: ids[0], seed: 7 })));
    expect(fetchMock).toHaveBeenCalledWith(`/api/runs/${ids[0]}`, expect.anything());

    fireEvent.change(screen.getByLabelText("Run title"), { target: { value: "Door-open proof" } });
    await act(async () => fireEvent.click(screen.getByRole("button", { name: "Save this run" })));
    await waitFor(() => expect(saveRun).toHaveBeenCalledTimes(1));
    expect(JSON.parse(String(saveRun.mock.calls[0][1].get("payload")))).toMatchObject({ plantRef: ref, title: "Door-open proof", seed: 11, actionLog: currentRun.actionLog, engineVersion: ENGINE_VERSION });
  });

  it("cannot save before there is a run", async () => {
    stubApi({ [`/api/runs?plant=${encodeURIComponent(ref)}`]: { runs: [] } });
    render(<RunHistory plantRef={ref} currentRun={null} onOpen={() => {}} onCompare={() => {}} />, { wrapper: freshSwr });
    expect(await screen.findByText("No saved runs for this plant yet.")).toBeTruthy();
    expect((screen.getByRole("button", { name: "Save this run" }) as HTMLButtonElement).disabled).toBe(true);
  });
});
