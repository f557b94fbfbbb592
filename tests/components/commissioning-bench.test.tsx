// The pre-commissioning page's client part: the Bench itself opened on a twin, with the engine
// worker replaced by a stand-in that records what the Bench sends. The twin starts at its
// operating point with its log's noise and step in the sensor chain (and says so), the free
// Bench's "Pre-commission this plant" link is not offered inside the flow, and the stage buttons
// open the Bench's own panels.
import { act, fireEvent, render, screen, within } from "@testing-library/react";
import type { ReactNode } from "react";
import { SWRConfig } from "swr";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { PlantListItem } from "@/db/bench-queries";
import { NO_FINDINGS, useBench } from "@/components/bench/store";
import { CommissioningBench } from "@/components/commissioning/CommissioningBench";
import { sensorChainSchema } from "@/sim/sensor/config";
import { noiseSigmaC } from "@/sim/drill/resolve";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import type { ToWorker } from "@/sim/worker/protocol";

vi.mock("uplot", () => ({ default: class { destroy() {} } }));
vi.mock("@/components/trend/Trend", () => ({ Trend: () => <div data-testid="trend-stub" /> }));
vi.mock("@/app/(app)/bench/actions", () => ({ saveTuningSet: vi.fn(), deleteTuningSet: vi.fn(), saveRun: vi.fn(), deleteRun: vi.fn(), savePlant: vi.fn(), updatePlant: vi.fn(), deletePlant: vi.fn(), setPlantShared: vi.fn() }));
vi.mock("@/app/(app)/records/actions", () => ({ createTuningRecord: vi.fn() }));
vi.mock("next/navigation", () => ({ useRouter: () => ({ push: vi.fn() }) }));

const sent: ToWorker[] = [];
class FakeWorker {
  onmessage: unknown = null;
  onerror: unknown = null;
  postMessage(msg: ToWorker) {
    sent.push(msg);
  }
  terminate() {}
}

const PLANT_ID = "7c1e0a52-3b9d-4f6e-8a21-5d4c3b2a1f00";
const twin: PlantDefinition = {
  kind: "transfer-function",
  gainCPerPercent: 1.4,
  timeConstantsS: [1100, 140],
  deadTimeS: 45,
  operatingPoint: { outPercent: 38, temperatureC: 72 },
  ambientC: 21,
  heaterRatingW: 3000,
  nominalVoltageV: 230,
  sensorTimeConstantS: 0,
};
const item: PlantListItem = { ref: `plant:${PLANT_ID}`, source: "own", id: PLANT_ID, title: "Oven O-3 (twin)", description: "", kind: "transfer-function", origin: "twin", shared: false, ownerName: "Ines", updatedAt: "2026-12-01T10:00:00.000Z", definition: twin, figures: null };
const freshSwr = ({ children }: { children: ReactNode }) => <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>{children}</SWRConfig>;

beforeEach(() => {
  sent.length = 0;
  useBench.getState().set({ findings: NO_FINDINGS, siteProof: null, savedTuningSet: null, focus: null });
  vi.stubGlobal("Worker", FakeWorker);
  vi.stubGlobal(
    "fetch",
    vi.fn(async (url: string) => {
      const body = url === "/api/plants" ? { plants: [item] } : url.startsWith("/api/tuning-sets") ? { tuningSets: [] } : url.startsWith("/api/runs") ? { runs: [] } : null;
      return new Response(JSON.stringify(body ?? { error: "No such thing." }), { status: body ? 200 : 404 });
    }),
  );
});
afterEach(() => vi.unstubAllGlobals());

describe("the Bench in the pre-commissioning flow", () => {
  it("opens a twin at its operating point with the noise and step of its log, and the stage buttons open the Bench's panels", async () => {
    render(<CommissioningBench plant={{ ref: item.ref, title: item.title, definition: twin, origin: "twin", sensorFromData: { noiseSigmaC: 0.15, quantizationStepC: 0.1 } }} />, { wrapper: freshSwr });
    await act(async () => {});
    const load = sent.find((m): m is Extract<ToWorker, { type: "load" }> => m.type === "load")!;
    expect(load.drill.plant).toEqual(twin);
    expect(load.drill.initialState).toMatchObject({ setpointC: 72, outPercent: 38 });
    const chain = sensorChainSchema.parse(load.drill.sensor);
    // the chain's σ leaves out the log's rounding, q²/12 (Widrow & Kollár, from memory): its ADC adds its own
    expect(noiseSigmaC(chain)).toBeCloseTo(Math.sqrt(0.15 ** 2 - 0.1 ** 2 / 12), 12);
    expect(chain.analogInput.bits).toBe(12);
    expect(screen.getByTestId("twin-sensor-note").textContent).toBe("Sensor noise from the uploaded data: σ ≈ 0.15 °C, step 0.1 °C (the Bench's 12-bit input: 0.073 °C)");
    expect(screen.queryByRole("link", { name: "Pre-commission this plant" })).toBeNull();
    const path = screen.getByRole("region", { name: "Hand-over path" });
    expect(within(path).getByRole("heading", { name: "Relay test and rule" })).toBeTruthy();

    const tab = (name: string) => screen.getByRole("tab", { name }).getAttribute("aria-selected");
    await act(async () => fireEvent.click(within(path).getByRole("button", { name: "Go to the relay test" })));
    expect(tab("Relay test")).toBe("true");
    await act(async () => fireEvent.click(within(path).getByRole("button", { name: "Show the power curve" })));
    expect(tab("Bump test")).toBe("true");
    await act(async () => fireEvent.click(within(path).getByRole("button", { name: "Go to the proof tests" })));
    expect(tab("Experiments")).toBe("true");
    expect(tab("PI vs PID")).toBe("true");
    // a twin has no enclosure: the airflow, door and cold-load disturbances are offered but disabled
    expect((screen.getByRole("checkbox", { name: /Door opened/ }) as HTMLInputElement).disabled).toBe(true);
    expect((screen.getByRole("checkbox", { name: /Ambient change/ }) as HTMLInputElement).checked).toBe(true);
  });
});
