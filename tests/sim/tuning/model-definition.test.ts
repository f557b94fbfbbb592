import { describe, expect, it } from "vitest";
import { modelOfTransferFunction, timeConstantsOf } from "@/sim/tuning/model-definition";
import { fopdt, sopdt } from "@/sim/tuning/models";

describe("model ↔ transfer-function definition", () => {
  it("one time constant is FOPDT, two are SOPDT with τ1 ≥ τ2 whatever their order", () => {
    expect(modelOfTransferFunction({ gainCPerPercent: 2, timeConstantsS: [120], deadTimeS: 10 })).toEqual({ kind: "fopdt", gainCPerPercent: 2, timeConstantS: 120, deadTimeS: 10 });
    const want = { kind: "sopdt", gainCPerPercent: 1.5, timeConstant1S: 300, timeConstant2S: 40, deadTimeS: 8 };
    expect(modelOfTransferFunction({ gainCPerPercent: 1.5, timeConstantsS: [300, 40], deadTimeS: 8 })).toEqual(want);
    expect(modelOfTransferFunction({ gainCPerPercent: 1.5, timeConstantsS: [40, 300], deadTimeS: 8 })).toEqual(want);
  });

  it("a model's time constants round-trip through a definition", () => {
    for (const m of [fopdt(0.8, 90, 5), sopdt(-1.2, 50, 400, 12)]) {
      expect(modelOfTransferFunction({ gainCPerPercent: m.gainCPerPercent, timeConstantsS: timeConstantsOf(m), deadTimeS: m.deadTimeS })).toEqual(m);
    }
    expect(timeConstantsOf(sopdt(1, 50, 400, 0))).toEqual([400, 50]);
  });
});
