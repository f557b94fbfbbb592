import { describe, expect, it } from "vitest";
import {
  amigo, cohenCoon, imcLambdaRow, simcPi, simcPid, simc, tyreusLuyben, zieglerNicholsNoOvershoot, zieglerNicholsReactionCurve,
  zieglerNicholsSomeOvershoot, zieglerNicholsUltimate, toBlockForm, isRefusal, allTunings, tuneByName, type RuleResult, type Tuning,
} from "@/sim/tuning/rules";
import { fopdt, sopdt } from "@/sim/tuning/models";

function ok(r: RuleResult): Tuning {
  if (isRefusal(r)) throw new Error(r.reason);
  return r;
}
function expectTuning(r: RuleResult, kc: number, ti: number, td: number, digits = 4) {
  const t = ok(r);
  expect(t.kc).toBeCloseTo(kc, digits);
  expect(t.tiS).toBeCloseTo(ti, digits);
  expect(t.tdS).toBeCloseTo(td, digits);
}

const checkPlant = fopdt(1, 10, 2); // references: K = 1, τ = 10, θ = 2 worked example
const ultimate = { ku: 10, puS: 2 * Math.PI }; // Bequette Ex. 5.3/6.1: 1/((3s+1)(2s+1)(s+1)), Ku = 10, Pu = 2π

describe("ultimate-point rules", () => {
  it("Ziegler–Nichols ultimate cycle (Bequette 2003 Table 6-1): P 5; PI 4.5, 5.23599; PID 6, 3.14159, 0.785398", () => {
    expectTuning(zieglerNicholsUltimate(ultimate, "P"), 5, 0, 0);
    expectTuning(zieglerNicholsUltimate(ultimate, "PI"), 4.5, 5.23599, 0);
    expectTuning(zieglerNicholsUltimate(ultimate, "PID"), 6, 3.14159, 0.785398);
  });

  it("Tyreus–Luyben (Bequette 2003 Table 6-2): PI 3.125, 13.8230; PID 4.54545, 13.8230, 0.997331", () => {
    expectTuning(tyreusLuyben(ultimate, "PI"), 3.125, 13.823, 0.0, 3);
    expectTuning(tyreusLuyben(ultimate, "PID"), 4.54545, 13.823, 0.997331, 3);
    const p = tyreusLuyben(ultimate, "P");
    expect(isRefusal(p) && p.notDefined).toBe(true);
  });

  it("ZN 'some overshoot' Ku/3, Pu/2, Pu/3 and 'no overshoot' Ku/5, Pu/2, Pu/3 (from memory, no primary source)", () => {
    expectTuning(zieglerNicholsSomeOvershoot(ultimate, "PID"), 10 / 3, Math.PI, (2 * Math.PI) / 3);
    expectTuning(zieglerNicholsNoOvershoot(ultimate, "PID"), 2, Math.PI, (2 * Math.PI) / 3);
  });

  it("refuses a bad ultimate point with a reason, never NaN", () => {
    const r = zieglerNicholsUltimate({ ku: NaN, puS: 5 }, "PI");
    expect(isRefusal(r)).toBe(true);
    expect(isRefusal(zieglerNicholsUltimate({ ku: 3, puS: 0 }, "PI"))).toBe(true);
  });
});

describe("model rules", () => {
  it("Ziegler–Nichols reaction curve (Bequette 2003 Table 6-3): P 5; PI 4.5, 6.6; PID 6, 4, 1", () => {
    expectTuning(zieglerNicholsReactionCurve(checkPlant, "P"), 5, 0, 0);
    expectTuning(zieglerNicholsReactionCurve(checkPlant, "PI"), 4.5, 6.6, 0);
    expectTuning(zieglerNicholsReactionCurve(checkPlant, "PID"), 6, 4, 1);
  });

  it("SIMC (Skogestad 2003): K=1, τ=10, θ=2 → Kc 2.5, τI 10; the paper's half-rule example PI 0.85034 / 2.5, PID 1.29870 / 2 / 1.2 (series)", () => {
    expectTuning(simcPi(checkPlant), 2.5, 10, 0);
    expectTuning(simcPi(fopdt(1, 2.5, 1.47)), 0.85034, 2.5, 0);
    const pid = ok(simcPid(sopdt(1, 2, 1.2, 0.77)));
    expectTuning(pid, 1.2987, 2, 1.2);
    expect(pid.form).toBe("series");
    // τI = min(τ1, 4(τc + θ)): the integral time is cut for a lag-dominant plant
    expectTuning(simcPi(fopdt(1, 100, 2)), 25, 16, 0);
    // PID needs the second time constant
    expect(isRefusal(simc(checkPlant, "PID"))).toBe(true);
  });

  it("IMC (Rivera, Morari & Skogestad 1986; Bequette 2003 Table 9-2), λ = 2: rows 2.75/11/0.909091/τF 0.5; 3.66667/11/0.909091; 5/10; 5.5/11", () => {
    const lag = ok(imcLambdaRow(checkPlant, "pid-lag", { lambdaS: 2 }));
    expectTuning(lag, 2.75, 11, 0.909091);
    expect(lag.filterTauS).toBeCloseTo(0.5, 10);
    expectTuning(imcLambdaRow(checkPlant, "pid", { lambdaS: 2 }), 3.66667, 11, 0.909091);
    expectTuning(imcLambdaRow(checkPlant, "pi", { lambdaS: 2 }), 5, 10, 0);
    expectTuning(imcLambdaRow(checkPlant, "pi-improved", { lambdaS: 2 }), 5.5, 11, 0);
    // λ = 2 is below Bequette's minimum 1.7θ = 3.4 s for the PI rows: the rule says so
    expect(ok(imcLambdaRow(checkPlant, "pi", { lambdaS: 2 })).notes.join(" ")).toMatch(/below Bequette's recommended minimum/);
  });

  it("Cohen–Coon (Bequette 2003 Table 6-4): P 5.33333; PI 4.58333, 4.70769; PID 6.91667, 4.54795, 0.701754", () => {
    expectTuning(cohenCoon(checkPlant, "P"), 5.33333, 0, 0);
    expectTuning(cohenCoon(checkPlant, "PI"), 4.58333, 4.70769, 0);
    expectTuning(cohenCoon(checkPlant, "PID"), 6.91667, 4.54795, 0.701754);
  });

  it("AMIGO (Åström & Hägglund 2004/2006, via the AMIGO_Tune.m thesis script): PI 1.20556, 7.76522; PID 2.45, 5.86667, 0.943396", () => {
    expectTuning(amigo(checkPlant, "PI"), 1.20556, 7.76522, 0);
    expectTuning(amigo(checkPlant, "PID"), 2.45, 5.86667, 0.943396);
  });

  it("refuses a non-positive gain or a zero dead time where the rule divides by it", () => {
    expect(isRefusal(cohenCoon(fopdt(-1, 10, 2), "PI"))).toBe(true);
    expect(isRefusal(amigo(fopdt(1, 10, 0), "PI"))).toBe(true);
    expect(isRefusal(simcPi(fopdt(1, 10, 0)))).toBe(true); // τc = θ = 0
    expect(ok(simcPi(fopdt(1, 10, 0), { tauCS: 5 })).kc).toBeCloseTo(2, 12);
  });

  it("allTunings lists every defined rule and controller type, all finite", () => {
    const all = allTunings({ ultimate, model: checkPlant });
    expect(all.length).toBeGreaterThan(15);
    for (const r of all) {
      const t = ok(r);
      expect(Number.isFinite(t.kc) && Number.isFinite(t.tiS) && Number.isFinite(t.tdS)).toBe(true);
    }
    expect(isRefusal(tuneByName("simc", "PI", { ultimate }))).toBe(true);
    expect(isRefusal(tuneByName("no-such-rule", "PI", { ultimate }))).toBe(true);
  });
});

describe("conversion to the block's forms (Åström & Hägglund 1995 §3.2)", () => {
  it("standard → parallel: Ki = Kc/Ti, Kd = Kc·Td", () => {
    const c = toBlockForm(ok(zieglerNicholsReactionCurve(checkPlant, "PID")), "parallel");
    expect(c.ok && c.tuning).toMatchObject({ kc: 6, ki: 1.5, kd: 6 });
  });

  it("standard → series exists for Ti ≥ 4Td (ZN ultimate PID: Ti = 4Td exactly, a double zero)", () => {
    const c = toBlockForm(ok(zieglerNicholsUltimate(ultimate, "PID")), "series");
    expect(c.ok).toBe(true);
    if (c.ok) {
      expect(c.tuning.kc).toBeCloseTo(3, 10); // Kc·Ti_s/Ti with Ti_s = Ti/2
      expect(c.tuning.ti).toBeCloseTo(Math.PI / 2, 10);
      expect(c.tuning.td).toBeCloseTo(Math.PI / 2, 10);
    }
  });

  it("standard → series with Ti < 4Td is 'not representable' with a reason, never NaN", () => {
    const c = toBlockForm(ok(zieglerNicholsNoOvershoot(ultimate, "PID")), "series");
    expect(c.ok).toBe(false);
    if (!c.ok) expect(c.reason).toMatch(/not representable.*4·Td/);
  });

  it("series (SIMC PID) → standard: Kc(1 + Td/Ti), Ti + Td, TiTd/(Ti + Td)", () => {
    const c = toBlockForm(ok(simcPid(sopdt(1, 2, 1.2, 0.77))), "standard");
    expect(c.ok).toBe(true);
    if (c.ok) {
      expect(c.tuning.kc).toBeCloseTo(1.2987 * 1.6, 3);
      expect(c.tuning.ti).toBeCloseTo(3.2, 10);
      expect(c.tuning.td).toBeCloseTo(0.75, 10);
    }
    const back = toBlockForm(ok(simcPid(sopdt(1, 2, 1.2, 0.77))), "series");
    expect(back.ok && back.tuning.td).toBeCloseTo(1.2, 12);
  });

  it("IMC PID + lag carries its τF as a PV filter suggestion", () => {
    const c = toBlockForm(ok(imcLambdaRow(checkPlant, "pid-lag", { lambdaS: 2 })), "standard");
    expect(c.ok && c.tuning.pvFilterTauS).toBeCloseTo(0.5, 12);
  });
});
