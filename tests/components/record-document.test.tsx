// Component test (Testing Library in jsdom): the record page's document shows the tuning in its
// form and units exactly as record-figures.ts writes it (the same strings the PDF carries), the
// safety caution, the sign-off state; the sign-off form sends what the action needs and shows
// its refusal. Units of the controller fields: sim/control/config.ts; Kc in % per °C is how
// the trade states a controller gain for a temperature loop (common practice).
import { fireEvent, render, screen, within } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import type { ActionResult } from "@/app/_lib/action";
import { recordDocumentSchema } from "@/app/_lib/records/record-document";
import { tuningFigures } from "@/app/_lib/records/record-figures";
import type { RecordDetail } from "@/app/_lib/records/record-queries";
import { RecordDocumentView } from "@/components/records/RecordDocumentView";
import { SignOffForm } from "@/components/records/SignOffForm";
import { controllerConfigSchema } from "@/sim/control/config";
import { findPreset } from "@/sim/plant/presets";

const controller = controllerConfigSchema.parse({ kind: "pid", form: "standard", kc: 4.75, ti: 385, td: 24, sampleTimeS: 0.5, pvFilterTauS: 3 });

function detail(over: Partial<RecordDetail> = {}): RecordDetail {
  const document = recordDocumentSchema.parse({
    plant: { ref: "preset:benchtop-curing-cabinet", name: "Benchtop curing cabinet", origin: "preset", definition: findPreset("benchtop-curing-cabinet")!.plant, sourceUpload: null },
    model: { kind: "fopdt", gainCPerPercent: 1.6, timeConstantS: 900, deadTimeS: 60 },
    modelSource: "reported",
    tuningSetName: "Cure PID",
    controller,
    margins: { gainMargin: 3.15, phaseMarginDeg: 60.4, ms: 1.5, verdict: "robust", delayMarginS: 125, messages: ["Ms = 1.5: a robust tuning with room for model error."] },
    drive: { kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 },
    powerCurve: null,
    relay: null,
    proofTests: [],
    engineVersion: "1.0.0",
  });
  return {
    id: "4f4819d0-a697-4f5c-8776-a134776a1335",
    title: "Cabinet C-2 hand-over",
    notes: "Kept the 3 s filter.",
    plantRef: "preset:benchtop-curing-cabinet",
    plantId: null,
    ownerId: "u1",
    authorName: "Maren Holt",
    isOwner: true,
    createdAt: new Date("2026-03-02T09:00:00Z"),
    updatedAt: new Date("2026-03-02T09:00:00Z"),
    signedOffBy: null,
    signedOffOn: null,
    signedOffAt: null,
    engineVersion: "1.0.0",
    document,
    ...over,
  };
}

describe("the record document", () => {
  it("shows the tuning as record-figures writes it, the caution and an open sign-off", () => {
    const d = detail();
    render(<RecordDocumentView detail={d} signOffSlot={<p>sign-off form here</p>} />);
    const tuning = screen.getByTestId("record-tuning");
    for (const f of tuningFigures(d.document.controller, d.document.drive)) {
      expect(within(tuning).getByText(f.value, { selector: `[data-figure="${f.key}"]` })).toBeTruthy();
    }
    expect(within(tuning).getByText("4.75 %/°C")).toBeTruthy();
    expect(within(tuning).getByText("tau 3 s")).toBeTruthy();
    expect(within(tuning).getByText("time-proportioning, cycle time 2 s")).toBeTruthy();
    // 20·log10(3.15) = 9.97 dB (definition of the decibel)
    expect(within(screen.getByTestId("record-margins")).getByText("3.15 (9.97 dB)")).toBeTruthy();
    expect(screen.getByRole("note").textContent).toMatch(/local codes/);
    expect(screen.getByText("Not signed off.")).toBeTruthy();
    expect(screen.getByText("sign-off form here")).toBeTruthy();
  });

  it("once signed off, names the signer and offers no form", () => {
    render(<RecordDocumentView detail={detail({ signedOffBy: "Maren Holt", signedOffOn: "2026-03-03" })} signOffSlot={<p>sign-off form here</p>} />);
    expect(screen.getByTestId("record-signed-off").textContent).toBe("Signed off by Maren Holt on 2026-03-03. The record is frozen.");
    expect(screen.queryByText("sign-off form here")).toBeNull();
  });
});

describe("SignOffForm", () => {
  it("sends the record, the name and the date, and shows the refusal", async () => {
    const action = vi.fn(async (_p: ActionResult, form: FormData): Promise<ActionResult> => ({
      ok: false,
      error: `Refused ${form.get("recordId")} for ${form.get("name")} on ${form.get("date")}.`,
    }));
    render(<SignOffForm recordId="r-1" today="2026-03-04" suggestedName="Maren Holt" action={action} />);
    fireEvent.click(screen.getByRole("button", { name: "Sign off and freeze" }));
    expect((await screen.findByTestId("form-error")).textContent).toBe("Refused r-1 for Maren Holt on 2026-03-04.");
  });
});
