// Claim check (sim/drill/claim-check.ts). Source: the stated CLAIM_TOLERANCE itself (0.05 points
// absolute on the score and each window score; exact fingerprint) — our own definition.
import { describe, expect, it } from "vitest";
import { CLAIM_TOLERANCE, checkClaim } from "@/sim/drill";

const official = { score: 52.3, fingerprint: "0123456789abcdef", windows: [{ id: "a", score: 50 }, { id: "b", score: 54.6 }] };

describe("checkClaim", () => {
  it("states its tolerance (definition)", () => {
    expect(CLAIM_TOLERANCE.score).toBe(0.05);
    expect(CLAIM_TOLERANCE.windowScore).toBe(0.05);
    expect(CLAIM_TOLERANCE.fingerprint).toBe("exact");
  });

  it("accepts an honest claim, with or without fingerprint and RunResults-shaped results", () => {
    expect(checkClaim({ score: 52.3 }, official)).toEqual({ ok: true });
    expect(checkClaim({ score: 52.34, fingerprint: official.fingerprint }, official)).toEqual({ ok: true });
    expect(checkClaim({ score: 52.3, results: { windows: [{ id: "a", kind: "setpoint" }] } }, official)).toEqual({ ok: true });
    expect(checkClaim({ score: 52.3, results: {} }, official)).toEqual({ ok: true });
  });

  it("a score beyond 0.05 points is a mismatch with a readable reason", () => {
    const r = checkClaim({ score: 78 }, official);
    expect(r).toEqual({ ok: false, reason: "Claimed score 78.0, replay 52.3 (differs by 25.7 points; tolerance 0.05)." });
    const small = checkClaim({ score: 52.36 }, official);
    expect(small.ok).toBe(false);
    if (!small.ok) expect(small.reason).toMatch(/differs by 0\.06 points/);
  });

  it("a different fingerprint is a mismatch (exact equality)", () => {
    const r = checkClaim({ score: 52.3, fingerprint: "fedcba9876543210" }, official);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/fingerprint/);
  });

  it("window scores, when claimed, must each be within 0.05", () => {
    expect(checkClaim({ score: 52.3, results: { windows: [{ id: "a", score: 50.01 }, { id: "b", score: 54.6 }] } }, official)).toEqual({ ok: true });
    const r = checkClaim({ score: 52.3, results: { windows: [{ id: "a", score: 50 }, { id: "b", score: 60 }] } }, official);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/Window "b": claimed 60\.0, replay 54\.6/);
    const bad = checkClaim({ score: 52.3, results: { windows: [{ id: "a", score: 50 }, { id: "b", score: "x" }] } }, official);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.reason).toMatch(/unreadable/);
  });

  it("never throws on odd input", () => {
    const odd: unknown[] = [null, undefined, 5, "x", { score: Number.NaN }, { score: "50" }, { score: 52.3, results: { windows: 7 } }, { score: 52.3, results: [1, 2] }];
    for (const c of odd) {
      const r = checkClaim(c as never, official);
      expect(typeof r.ok).toBe("boolean");
    }
    expect(checkClaim({ score: Number.NaN }, official).ok).toBe(false);
    expect(checkClaim({ score: 52.3, results: { windows: 7 } }, official).ok).toBe(false);
    expect(checkClaim({ score: 52.3 }, null as never).ok).toBe(false);
  });
});
