import { describe, expect, it } from "vitest";
import { guessMapping, guessMappingForText, normaliseHeader, readLogTable, saysFahrenheit, type LogTable } from "@/sim/import";

function table(text: string, headerRow = true): LogTable {
  const r = readLogTable(text, { delimiter: "auto", headerRow });
  if (!r.ok) throw new Error(r.message);
  return r.table;
}

describe("guessMapping", () => {
  it("finds columns by name, units in brackets ignored, in any order", () => {
    const m = guessMapping(table("Mode,Setpoint [°C],Temperature (°C),Output [%],Timestamp\nMAN,60,59.9,30,2026-03-04T10:00:00\n"));
    expect(m.columns).toEqual({ time: 4, out: 3, pv: 2, sp: 1, mode: 0 });
    expect(m.timeFormat).toBe("timestamp");
    expect(m.temperatureUnit).toBe("C");
  });
  it("knows the short and the engine's own names (t, out%, pv; timeS, outPercent, pvRawC)", () => {
    expect(guessMapping(table("t,out%,pv\n0,1,2\n")).columns).toMatchObject({ time: 0, out: 1, pv: 2 });
    const cli = guessMapping(table("timeS,setpointC,pvRawC,pvFilteredC,trueC,outPercent,heaterPowerW,heaterOn\n0,60,60,60,60,30,300,1\n"));
    expect(cli.columns).toEqual({ time: 0, out: 5, pv: 2, sp: 1, mode: null });
    expect(guessMapping(table("auto/man;temp;time;out\nA;1;2;3\n")).columns).toMatchObject({ mode: 0, pv: 1, time: 2, out: 3 });
  });
  it("°F in the PV or SP header means temperature unit F", () => {
    expect(guessMapping(table("time\tPV [°F]\tOUT [%]\n0\t300\t40\n")).temperatureUnit).toBe("F");
    expect(guessMapping(table("time,temp degF,out\n0,300,40\n")).temperatureUnit).toBe("F");
    expect(saysFahrenheit("PV (F)")).toBe(true);
    expect(saysFahrenheit("Filter time")).toBe(false);
    expect(normaliseHeader("PV [°C]")).toBe("pv");
  });
  it("decimal comma when ';' or tab separates and cells read '12,5'; never with ','", () => {
    expect(guessMapping(table("time;OUT;PV\n0;30,0;20,5\n1;30,0;20,6\n")).decimalMark).toBe(",");
    expect(guessMapping(table("time\tOUT\tPV\n0\t30.0\t20.5\n")).decimalMark).toBe(".");
    expect(guessMapping(table("time,OUT,PV\n0,30.0,20.5\n")).decimalMark).toBe(".");
  });
  it("without a header (or a 'header' of numbers) the first three columns are time, OUT, PV", () => {
    const m = guessMapping(table("0;30,0;20,5;x\n1;30,0;20,6;y\n"));
    expect(m.headerRow).toBe(false);
    expect(m.columns).toEqual({ time: 0, out: 1, pv: 2, sp: null, mode: null });
    expect(guessMapping(table("0,30,20\n1,30,21\n", false)).columns).toMatchObject({ time: 0, out: 1, pv: 2 });
  });
  it("guessMappingForText reads a header-less file again without a header", () => {
    const g = guessMappingForText("0,30,20\n1,30,21\n2,30,22\n");
    expect(g.ok && g.mapping.headerRow).toBe(false);
    expect(g.ok && g.table.rows.length).toBe(3);
    const e = guessMappingForText("# nothing\n");
    expect(!e.ok && e.code).toBe("empty");
  });
  it("timestamps written day.month.year are recognised", () => {
    expect(guessMapping(table("Zeit;OUT;PV\n04.03.2026 10:00:00;30;20\n04.03.2026 10:00:05;30;20\n")).timeFormat).toBe("timestamp");
  });
});
