// A fit becomes a twin's plant definition (app/_lib/twins/twin-definition.ts), and the small pure
// helpers around an upload: decoding, checksum, download header, long-log reduction.
import { describe, expect, it } from "vitest";
import { attachmentDisposition, fileNameSlug, logMediaType } from "@/app/_lib/http/content-disposition";
import { sha256Hex } from "@/app/_lib/twins/checksum";
import { decodeLogBytes } from "@/app/_lib/twins/decode-log";
import { onFullRecord, reduceForFit } from "@/app/_lib/twins/fit-record";
import { twinDefinition } from "@/app/_lib/twins/twin-definition";
import { plantDefinitionSchema } from "@/sim/plant/plant-definition";
import { fopdt, sopdt } from "@/sim/tuning/models";
import { identifyStepResponse } from "@/sim/tuning/identify";

describe("twinDefinition", () => {
  const step = { outBeforePercent: 30, pvBeforeC: 48.5 };

  it("an FOPDT fit: one time constant, operating point before the step, ambient = PV before the step when none is given", () => {
    const d = twinDefinition(fopdt(0.8, 240, 35), step, { name: "Oven" });
    expect(d).toMatchObject({
      kind: "transfer-function",
      name: "Oven",
      gainCPerPercent: 0.8,
      timeConstantsS: [240],
      deadTimeS: 35,
      operatingPoint: { outPercent: 30, temperatureC: 48.5 },
      ambientC: 48.5,
    });
    // the plant schema's defaults (sim/plant/transfer-function-params.ts)
    expect(d).toMatchObject({ heaterRatingW: 1000, nominalVoltageV: 230, sensorTimeConstantS: 0 });
    expect(plantDefinitionSchema.safeParse(d).success).toBe(true);
  });

  it("an SOPDT fit: τ1 ≥ τ2 in that order; a given ambient is used as given", () => {
    const d = twinDefinition(sopdt(1.1, 60, 300, 30), step, { name: "Dryer", ambientC: 19 });
    expect(d.timeConstantsS).toEqual([300, 60]);
    expect(d.ambientC).toBe(19);
  });

  it("clamps an OUT a hair outside 0–100 % to the schema's range; refuses a non-positive time constant", () => {
    expect(twinDefinition(fopdt(0.5, 100, 0), { outBeforePercent: -0.2, pvBeforeC: 20 }, { name: "x" }).operatingPoint.outPercent).toBe(0);
    expect(() => twinDefinition(fopdt(0.5, 0, 0), step, { name: "x" })).toThrow();
    expect(() => twinDefinition(fopdt(Number.NaN, 10, 0), step, { name: "x" })).toThrow();
  });
});

describe("decodeLogBytes", () => {
  it("strips a UTF-8 BOM, falls back to Windows-1252 for invalid UTF-8, reads UTF-16 with its BOM, refuses NUL bytes", () => {
    // byte values: BOM EF BB BF (Unicode Standard §23.8), ° = B0 in Windows-1252 and U+00B0 (from memory)
    expect(decodeLogBytes(new Uint8Array([0xef, 0xbb, 0xbf, 0x61]))).toEqual({ ok: true, text: "a", encoding: "utf-8" });
    expect(decodeLogBytes(new Uint8Array([0x50, 0x56, 0xb0, 0x43]))).toEqual({ ok: true, text: "PV°C", encoding: "windows-1252" });
    expect(decodeLogBytes(new Uint8Array([0xff, 0xfe, 0x74, 0x00, 0x3b, 0x00]))).toEqual({ ok: true, text: "t;", encoding: "utf-16le" });
    expect(decodeLogBytes(new Uint8Array([0xfe, 0xff, 0x00, 0x74]))).toEqual({ ok: true, text: "t", encoding: "utf-16be" });
    expect(decodeLogBytes(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x00]))).toMatchObject({ ok: false, message: expect.stringMatching(/not text/) });
    expect(decodeLogBytes(Buffer.from("PV °C", "utf8"))).toEqual({ ok: true, text: "PV °C", encoding: "utf-8" });
  });
});

describe("checksum and download header", () => {
  it("SHA-256 of 'abc' is the FIPS 180-4 example digest", () => {
    // FIPS 180-4 / NIST CSRC example "SHA256.pdf": SHA-256("abc")
    expect(sha256Hex(Buffer.from("abc"))).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("Content-Disposition: ASCII fallback and RFC 8187 filename* for other characters (RFC 6266 §4.3)", () => {
    expect(attachmentDisposition("oven.csv")).toBe(`attachment; filename="oven.csv"; filename*=UTF-8''oven.csv`);
    expect(attachmentDisposition('Ofen "3" °C.csv')).toBe(`attachment; filename="Ofen _3_ _C.csv"; filename*=UTF-8''Ofen%20%223%22%20%C2%B0C.csv`);
    expect(logMediaType("a.TSV")).toBe("text/tab-separated-values");
    expect(logMediaType("a.csv")).toBe("text/csv");
    expect(logMediaType("a.log")).toBe("application/octet-stream");
  });

  it("a file name's stem from a title: accents dropped, dashes between ASCII letters and digits", () => {
    expect(fileNameSlug("Trockner 3 — Übergabe", "x")).toBe("trockner-3-ubergabe");
    expect(fileNameSlug("°°°", "tuning-record")).toBe("tuning-record");
    expect(fileNameSlug("a".repeat(100), "x")).toHaveLength(80);
  });
});

describe("long logs: the fit on a reduced record", () => {
  // an exact FOPDT step response (no noise): y = y0 + KΔu(1 − e^{−(t−t0−θ)/τ}) after the dead time
  // (Seborg, Edgar & Mellichamp, Process Dynamics and Control, from memory)
  const n = 6000;
  const t = Array.from({ length: n }, (_, i) => i * 0.5);
  const out = t.map((s) => (s >= 300 ? 45 : 25));
  const pv = t.map((s) => 40 + (s - 345 > 0 ? 0.7 * 20 * (1 - Math.exp(-(s - 345) / 400)) : 0));

  it("keeps a block boundary at the step and the rows after it as logged; times stay increasing", () => {
    const { record, blockSize } = reduceForFit({ t, out, pv }, 1200);
    expect(blockSize).toBeGreaterThan(1);
    expect(record.t.length).toBeLessThanOrEqual(1200);
    for (let i = 1; i < record.t.length; i++) expect(record.t[i]).toBeGreaterThan(record.t[i - 1]);
    const first = record.out.findIndex((u) => u !== 25);
    expect(record.out[first]).toBe(45); // no averaged half-step
    expect(record.t[first]).toBe(300);
    expect(record.t.slice(first, first + 5)).toEqual([300, 300.5, 301, 301.5, 302]);
  });

  it("finds the generating model again and restates the quality on every row", () => {
    const { record, blockSize } = reduceForFit({ t, out, pv }, 1200);
    const id = identifyStepResponse(record);
    if (!id.ok) throw new Error(id.message);
    const full = onFullRecord(id, { t, out, pv }, blockSize);
    expect(full.fopdt.model.gainCPerPercent).toBeCloseTo(0.7, 3);
    expect(full.fopdt.model.timeConstantS).toBeCloseTo(400, 0);
    expect(full.fopdt.model.deadTimeS).toBeCloseTo(45, 0);
    expect(full.fopdt.predicted).toHaveLength(n);
    expect(full.samples.count).toBe(n);
    expect(full.fopdt.quality.r2).toBeGreaterThan(0.9999);
  });
});
