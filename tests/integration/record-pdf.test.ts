// The tuning record's PDF: produced from a real record (real database, proof test re-run by the
// engine), a PDF by its header ("%PDF-", ISO 32000-1 §7.5.2), and its text — extracted with
// pdfjs-dist, an independent reader — carries every tuning and margin value the page shows (one
// formatting module for both: record-figures.ts), and the sign-off name once signed.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { createTuningSet, type BenchUser } from "@/app/_lib/bench-store";
import { createTuningRecord } from "@/app/_lib/records/create-record";
import { recordDetail } from "@/app/_lib/records/record-queries";
import { recordPdf } from "@/app/_lib/records/record-pdf";
import { marginFigures, tuningFigures } from "@/app/_lib/records/record-figures";
import { signOffRecord } from "@/app/_lib/records/update-record";
import { hashPassword } from "@/app/_lib/password";
import { newUserId } from "@/app/_lib/tokens";
import { getDb } from "@/db/client";
import { organizations, users } from "@/db/schema";
import { DEMO_ORGANIZATION } from "@/db/seed";
import { drillSchema, type DrillInput } from "@/sim/drill/schema";
import ladder from "@/sim/examples/setpoint-ladder.json";
import { uniqueEmail } from "./helpers";

let author: BenchUser;
const pid = { kind: "pid", form: "standard", kc: 4.75, ti: 385, td: 24, sampleTimeS: 0.5, pvFilterTauS: 3 } as const;

beforeAll(async () => {
  const [demo] = await getDb().select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
  const id = newUserId();
  await getDb()
    .insert(users)
    .values({ id, organizationId: demo.id, email: uniqueEmail("pdf"), displayName: "Maren Pdf", passwordHash: await hashPassword("unused"), role: "trainee" });
  author = { id, organizationId: demo.id };
});

async function pdfTextOf(buf: Buffer): Promise<{ text: string; pages: number }> {
  const pdf = await getDocument({ data: new Uint8Array(buf), useSystemFonts: false, disableFontFace: true, verbosity: 0 }).promise;
  const parts: string[] = [];
  for (let p = 1; p <= pdf.numPages; p++) {
    const content = await (await pdf.getPage(p)).getTextContent();
    for (const item of content.items) if ("str" in item) parts.push(item.str);
  }
  // a value may wrap onto a second line: compare with runs of white space collapsed
  return { text: parts.join(" ").replace(/\s+/g, " "), pages: pdf.numPages };
}
const squash = (s: string) => s.replace(/\s+/g, " ");

describe("the tuning record's PDF", () => {
  it("is a PDF whose text holds the page's tuning and margin values, then the sign-off", async () => {
    const set = await createTuningSet(author, { plantRef: "preset:benchtop-curing-cabinet", name: `PDF PID ${Date.now()}`, notes: "", controller: pid });
    const drill: DrillInput = {
      ...(ladder as DrillInput),
      id: "pdf-proof",
      events: [{ type: "setpoint", timeS: 60, setpointC: 68 }],
      scoring: { ...(ladder as DrillInput).scoring, windows: [{ id: "s", label: "60 → 68 °C", kind: "setpoint", startS: 60, endS: 900, weight: 1 }] },
      durationS: 900,
    };
    const { id } = await createTuningRecord(author, {
      plantRef: "preset:benchtop-curing-cabinet",
      tuningSetId: set.id,
      title: "Cabinet C-2 hand-over (PDF check)",
      notes: "Kept the 3 s filter.",
      model: { kind: "fopdt", gainCPerPercent: 1.6, timeConstantS: 900, deadTimeS: 60 },
      relay: { kind: "relay", ultimateGain: 14, ultimatePeriodS: 260, pvAmplitudeC: 0.9, relayAmplitudePercent: 10, rule: "tyreus-luyben" },
      powerCurve: { kind: "power-curve", points: [{ outPercent: 20, temperatureC: 52 }, { outPercent: 40, temperatureC: 84 }] },
      proofTests: [{ kind: "proof", label: "Step to 68 °C", tuningLabel: "PID", drill: drillSchema.parse(drill), drillVersion: null, controller: { ...drill.referenceTuning, ...pid } as never, seed: 3 }],
    });
    const detail = (await recordDetail(author, id))!;
    const buf = await recordPdf(detail);
    if (process.env.RECORD_PDF_OUT) (await import("node:fs")).writeFileSync(process.env.RECORD_PDF_OUT, buf); // to look at by hand
    expect(buf.subarray(0, 5).toString("latin1")).toBe("%PDF-"); // ISO 32000-1 §7.5.2 file header
    const { text, pages } = await pdfTextOf(buf);
    expect(pages).toBeGreaterThanOrEqual(2); // the proof test has its own page

    const shown = [...tuningFigures(detail.document.controller, detail.document.drive), ...marginFigures(detail.document)];
    for (const key of ["kc", "ti", "td", "pvFilter", "sampleTime", "drive", "gainMargin", "phaseMargin", "ms"]) {
      expect(shown.find((f) => f.key === key), key).toBeDefined();
    }
    for (const f of shown) expect(text, `${f.label} ${f.value}`).toContain(squash(f.value));
    expect(text).toContain("4.75 %/°C"); // Kc as set, in % output per °C (sim/control/config.ts units)
    expect(text).toContain("cycle time 2 s");
    expect(text).toContain("Not signed off.");
    expect(text).toContain("local codes"); // the safety caution
    expect(text).toContain("60 -> 68 °C"); // a window label, with the arrow spelled for WinAnsi

    await signOffRecord(author, { recordId: id, name: "Maren Pdf-Signer", date: new Date().toISOString().slice(0, 10) });
    const signed = await pdfTextOf(await recordPdf((await recordDetail(author, id))!));
    expect(signed.text).toContain("Signed off by Maren Pdf-Signer on");
    expect(signed.text).not.toContain("Not signed off.");
  });
});
