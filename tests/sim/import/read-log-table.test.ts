import { describe, expect, it } from "vitest";
import { guessDelimiter, readLogTable } from "@/sim/import";

const auto = { delimiter: "auto" as const, headerRow: true };

describe("readLogTable", () => {
  it("splits a decimal-comma file on ';' (papaparse alone would pick ',')", () => {
    expect(guessDelimiter("1,5;20,3\n2,5;20,4\n3,5;20,6\n")).toBe(";");
    expect(guessDelimiter("t;out;pv\n0;30,0;20,1\n1;30,0;20,2\n")).toBe(";");
    expect(guessDelimiter("t\tout\tpv\n0\t30,0\t20,1\n")).toBe("\t");
    expect(guessDelimiter("t,out,pv\n0,30.0,20.1\n1,30.0,20.2\n")).toBe(",");
    const r = readLogTable("1,5;20,3\n2,5;20,4\n", { delimiter: "auto", headerRow: false });
    expect(r.ok && r.table.rows).toEqual([["1,5", "20,3"], ["2,5", "20,4"]]);
  });
  it("strips a BOM, skips comments and blank lines, and keeps each row's file line", () => {
    const text = "\ufeff# logger export\r\n\r\ntime;OUT;PV\r\n# a note\r\n0;30;20\r\n\r\n  \r\n1;30;21\r\n;;\r\n2;30;22";
    const r = readLogTable(text, auto);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.table.headers).toEqual(["time", "OUT", "PV"]);
    expect(r.table.rows).toEqual([["0", "30", "20"], ["1", "30", "21"], ["2", "30", "22"]]);
    expect(r.table.lineNumbers).toEqual([5, 8, 10]);
    expect(r.table.delimiter).toBe(";");
    expect(r.table.columnCount).toBe(3);
  });
  it("handles quoted cells (RFC 4180 quoting) and counts lines from a row's start", () => {
    const r = readLogTable('t,"OUT, %",pv\n0,30,"note\nacross lines"\n1,30,21\n', auto);
    expect(r.ok && r.table.headers).toEqual(["t", "OUT, %", "pv"]);
    expect(r.ok && r.table.lineNumbers).toEqual([2, 4]);
  });
  it("an explicit delimiter is used as given", () => {
    const r = readLogTable("a;b,c\n1;2,3\n", { delimiter: ",", headerRow: false });
    expect(r.ok && r.table.rows[1]).toEqual(["1;2", "3"]);
  });
  it("refuses an empty file, one of comments only, and a header without rows with code empty", () => {
    for (const text of ["", "   \n\n", "# only a comment\n# and another\n"]) {
      const r = readLogTable(text, auto);
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(r.code).toBe("empty");
        expect(r.message).toMatch(/empty|comment/);
      }
    }
    const h = readLogTable("# x\ntime,out,pv\n", auto);
    expect(!h.ok && h.code).toBe("empty");
    expect(!h.ok && h.message).toMatch(/header \(line 2\) but no data rows/);
  });
  it("refuses an unclosed quote as unreadable, naming its line", () => {
    const r = readLogTable('t,out,pv\n0,30,20\n1,30,"21\n2,30,22\n', auto);
    expect(!r.ok && r.code).toBe("unreadable");
    expect(!r.ok && r.message).toMatch(/^line 3: a quoted cell is not closed/);
  });
});
