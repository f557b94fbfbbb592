// The record as a PDF (pdfkit, standard Helvetica from its built-in AFM metrics: nothing is
// fetched or embedded). A4, the same figures as the page (record-figures.ts), each proof test on
// its own page with its results table and a small vector trend, the sign-off block kept on one
// page, and the safety caution up front.
import PDFDocument from "pdfkit";
import { traceColors } from "@/tailwind.config";
import type { ProofTestStored } from "./record-document";
import type { RecordDetail } from "./record-queries";
import {
  drillVersionText,
  marginFigures,
  modelFigures,
  num,
  plantFigures,
  powerCurveRows,
  PROOF_COLUMNS,
  proofFacts,
  proofRows,
  relayFigures,
  SAFETY_CAUTION,
  tuningFigures,
  type Figure,
} from "./record-figures";
import { pdfText } from "./pdf-text";
import { trendScale } from "./trend-scale";

const M = 50; // page margin, pt
const W = 595.28 - 2 * M; // A4 text width
const INK = "#1f2326";
const SOFT = "#4b5258";
const RULE = "#b9b5aa";
const CAUTION = "#735a18";

type Doc = PDFKit.PDFDocument;

const isoDate = (d: Date) => d.toISOString().slice(0, 10);

function heading(doc: Doc, text: string) {
  ensureSpace(doc, 60);
  doc.moveDown(0.8);
  doc.font("Helvetica-Bold").fontSize(11).fillColor(INK).text(pdfText(text), M, doc.y, { width: W });
  const y = doc.y + 2;
  doc.moveTo(M, y).lineTo(M + W, y).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.y = y + 6;
}

function ensureSpace(doc: Doc, h: number) {
  if (doc.y + h > doc.page.height - M) doc.addPage();
}

/** Label and value rows; a value wraps in its own column. */
function figures(doc: Doc, list: Figure[], labelWidth = 120) {
  doc.fontSize(9);
  for (const f of list) {
    const value = pdfText(f.value);
    doc.font("Helvetica");
    const h = Math.max(doc.heightOfString(value, { width: W - labelWidth }), 11);
    ensureSpace(doc, h + 3);
    const y = doc.y;
    doc.font("Helvetica").fillColor(SOFT).text(pdfText(f.label), M, y, { width: labelWidth - 8 });
    doc.font("Helvetica").fillColor(INK).text(value, M + labelWidth, y, { width: W - labelWidth });
    doc.y = y + h + 3;
  }
}

function table(doc: Doc, columns: readonly string[], rows: string[][], widths: number[]) {
  const x0 = [M];
  for (const w of widths.slice(0, -1)) x0.push(x0[x0.length - 1] + w);
  const line = (cells: readonly string[], bold: boolean) => {
    doc.font(bold ? "Helvetica-Bold" : "Helvetica").fontSize(8.5);
    const h = Math.max(...cells.map((c, i) => doc.heightOfString(pdfText(c), { width: widths[i] - 6 }))) + 4;
    ensureSpace(doc, h);
    const y = doc.y;
    cells.forEach((c, i) => doc.fillColor(bold ? SOFT : INK).text(pdfText(c), x0[i], y + 2, { width: widths[i] - 6 }));
    doc.moveTo(M, y + h).lineTo(M + W, y + h).lineWidth(0.3).strokeColor(RULE).stroke();
    doc.y = y + h;
  };
  line(columns, true);
  for (const r of rows) line(r, false);
  doc.x = M;
}

/** SP (dashed graphite), PV (steel blue) on the temperature axis; OUT (ember) on its own 0–100 % axis. */
function trend(doc: Doc, t: ProofTestStored) {
  const h = 170;
  ensureSpace(doc, h + 40);
  const top = doc.y + 4;
  const left = M + 34;
  const width = W - 34 - 34;
  const rows = t.trend;
  if (rows.length < 2) return;
  const scale = trendScale(rows);
  const { t0, lo, hi } = scale;
  const t1 = scale.t1 || 1;
  const x = (s: number) => left + scale.xFraction(s) * width;
  const yT = (c: number) => top + h - scale.tempFraction(c) * h;
  const yO = (p: number) => top + h - scale.outFraction(p) * h;
  doc.save();
  doc.rect(left, top, width, h).lineWidth(0.5).strokeColor(RULE).stroke();
  const poly = (col: number, y: (v: number) => number, color: string, dashed: boolean) => {
    doc.moveTo(x(rows[0][0]), y(rows[0][col]));
    for (let i = 1; i < rows.length; i++) doc.lineTo(x(rows[i][0]), y(rows[i][col]));
    doc.lineWidth(0.8).strokeColor(color);
    if (dashed) doc.dash(3, { space: 2 });
    doc.stroke();
    doc.undash();
  };
  poly(3, yO, traceColors.out, false);
  poly(1, yT, traceColors.sp, true);
  poly(2, yT, traceColors.pv, false);
  doc.restore();
  doc.font("Helvetica").fontSize(7).fillColor(SOFT);
  doc.text(`${num(hi, 4)} °C`, M, top - 3, { width: 32, align: "right" });
  doc.text(`${num(lo, 4)} °C`, M, top + h - 6, { width: 32, align: "right" });
  doc.text("100 %", left + width + 3, top - 3, { width: 32 });
  doc.text("0 %", left + width + 3, top + h - 6, { width: 32 });
  doc.text(`${num(t0 / 60, 4)} min`, left, top + h + 3, { width: 60 });
  doc.text(`${num(t1 / 60, 4)} min`, left + width - 60, top + h + 3, { width: 60, align: "right" });
  const keyY = top + h + 14;
  const key = (label: string, color: string, at: number, dashed = false) => {
    doc.save().moveTo(at, keyY + 4).lineTo(at + 16, keyY + 4).lineWidth(1.2).strokeColor(color);
    if (dashed) doc.dash(3, { space: 2 });
    doc.stroke().undash().restore();
    doc.fillColor(SOFT).text(label, at + 20, keyY, { width: 120, lineBreak: false });
  };
  key("SP", traceColors.sp, left, true);
  key("PV (as measured)", traceColors.pv, left + 60);
  key("OUT, right axis", traceColors.out, left + 170);
  doc.x = M;
  doc.y = keyY + 16;
}

function proofTest(doc: Doc, t: ProofTestStored, i: number) {
  doc.addPage();
  doc.font("Helvetica-Bold").fontSize(12).fillColor(INK).text(pdfText(`Proof test ${i + 1}: ${t.label}`), M, M, { width: W });
  doc.moveDown(0.4);
  figures(doc, proofFacts(t));
  doc.moveDown(0.5);
  doc.font("Helvetica").fontSize(8).fillColor(SOFT).text("Measured by the server's re-run, on the simulated air temperature (what the drills score).", M, doc.y, { width: W });
  doc.moveDown(0.3);
  table(doc, PROOF_COLUMNS, proofRows(t), [175, 85, 75, 80, 80]);
  doc.moveDown(0.8);
  trend(doc, t);
}

function signOff(doc: Doc, d: RecordDetail) {
  const h = 130;
  if (doc.y + h > doc.page.height - M) doc.addPage(); // the block stays together
  heading(doc, "Sign-off");
  doc.font("Helvetica").fontSize(9).fillColor(INK);
  if (d.signedOffBy && d.signedOffOn) {
    doc.text(pdfText(`Signed off by ${d.signedOffBy} on ${d.signedOffOn}.`), M, doc.y, { width: W });
    doc.fillColor(SOFT).text("The record is frozen: it cannot be changed after sign-off.", M, doc.y + 2, { width: W });
    return;
  }
  doc.text("Not signed off.", M, doc.y, { width: W });
  doc.moveDown(1.2);
  for (const label of ["Name", "Date", "Signature"]) {
    const y = doc.y + 14;
    doc.fillColor(SOFT).text(label, M, y - 10, { width: 70 });
    doc.moveTo(M + 70, y).lineTo(M + 330, y).lineWidth(0.5).strokeColor(INK).stroke();
    doc.y = y + 10;
  }
}

function footers(doc: Doc, d: RecordDetail) {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0; // writing in the margin must not start a new page
    doc.font("Helvetica").fontSize(7).fillColor(SOFT);
    doc.text(pdfText(`${d.title} · tuning record ${d.id}`), M, doc.page.height - 32, { width: W - 80, lineBreak: false });
    doc.text(`page ${i + 1} of ${range.count}`, M + W - 80, doc.page.height - 32, { width: 80, align: "right", lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}

export function recordPdf(d: RecordDetail): Promise<Buffer> {
  const doc = new PDFDocument({
    size: "A4",
    margin: M,
    bufferPages: true,
    info: { Title: pdfText(d.title), Author: pdfText(d.authorName), Subject: "Loopwright tuning record", Creator: "Loopwright" },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  const doc_ = d.document;

  doc.font("Helvetica").fontSize(8).fillColor(SOFT).text("LOOPWRIGHT TUNING RECORD", M, M, { width: W, characterSpacing: 1 });
  doc.moveDown(0.3);
  doc.font("Helvetica-Bold").fontSize(16).fillColor(INK).text(pdfText(d.title), { width: W });
  doc.moveDown(0.3);
  doc
    .font("Helvetica")
    .fontSize(9)
    .fillColor(SOFT)
    .text(pdfText(`Written by ${d.authorName} on ${isoDate(d.createdAt)} · engine ${doc_.engineVersion} · tuning set "${doc_.tuningSetName}"`), { width: W });
  doc.moveDown(0.6);
  const cautionTop = doc.y;
  doc.font("Helvetica").fontSize(8.5);
  const ch = doc.heightOfString(pdfText(SAFETY_CAUTION), { width: W - 16 });
  doc.rect(M, cautionTop, W, ch + 12).lineWidth(0.8).strokeColor(CAUTION).stroke();
  doc.fillColor(CAUTION).text(pdfText(SAFETY_CAUTION), M + 8, cautionTop + 6, { width: W - 16 });
  doc.x = M;
  doc.y = cautionTop + ch + 14;

  heading(doc, "Plant");
  figures(doc, plantFigures(doc_));
  heading(doc, "Model");
  figures(doc, modelFigures(doc_));
  heading(doc, "Tuning");
  figures(doc, tuningFigures(doc_.controller, doc_.drive));
  heading(doc, "Robustness margins (on the model)");
  figures(doc, marginFigures(doc_));
  for (const m of doc_.margins?.messages ?? []) {
    ensureSpace(doc, 24);
    doc.font("Helvetica").fontSize(8.5).fillColor(SOFT).text(pdfText(m), M, doc.y + 2, { width: W });
  }
  if (doc_.powerCurve) {
    heading(doc, "Power curve (reported by the flow)");
    table(doc, ["OUT", "Steady temperature"], powerCurveRows(doc_), [120, 375]);
  }
  if (doc_.relay) {
    heading(doc, "Relay test (reported by the flow)");
    figures(doc, relayFigures(doc_));
  }
  heading(doc, "Proof tests");
  doc.font("Helvetica").fontSize(9).fillColor(INK);
  if (doc_.proofTests.length === 0) doc.text("No proof test is part of this record.", M, doc.y, { width: W });
  else doc.text(pdfText(doc_.proofTests.map((t, i) => `${i + 1}. ${t.label} (${t.tuningLabel})`).join("\n")), M, doc.y, { width: W });
  heading(doc, "Notes");
  doc.font("Helvetica").fontSize(9).fillColor(INK).text(pdfText(d.notes || "No notes."), M, doc.y, { width: W });
  doc_.proofTests.forEach((t, i) => proofTest(doc, t, i));
  heading(doc, "Versions");
  figures(doc, [
    { key: "engine", label: "Engine", value: doc_.engineVersion },
    ...doc_.proofTests.map((t, i) => ({
      key: `drill${i}`,
      label: `Test ${i + 1} drill`,
      value: drillVersionText(t),
    })),
    { key: "record", label: "Record", value: `${d.id}, last changed ${isoDate(d.updatedAt)}` },
  ]);
  signOff(doc, d);
  footers(doc, d);
  doc.end();
  return done;
}
