// The standings' sort and filter helpers: measures that do not exist (a loop that never settled or
// never recovered) sort last in both directions; ties keep the rank order; the filter matches a
// substring of the trainee's label and the staff's flag and late filters. (Our own rules.)
import { describe, expect, it } from "vitest";
import type { StandingsRow } from "@/app/_lib/classroom/contracts";
import { defaultDirection, filterStandings, sortStandings } from "@/components/standings/standings-sort";

function row(rank: number, label: string, over: Partial<StandingsRow["summary"]> = {}, extra: Partial<StandingsRow> = {}): StandingsRow {
  return {
    rank,
    attemptId: null,
    traineeLabel: label,
    isViewer: false,
    attemptNumber: 1,
    attemptsUsed: 1,
    submittedAt: `2026-11-0${rank}T10:00:00Z`,
    late: false,
    flagged: false,
    summary: { score: 100 - rank * 10, rawScore: 100 - rank * 10, settlingTimeS: 100 * rank, overshootC: rank / 2, iae: 1000 * rank, recoveryTimeS: 50 * rank, energyKWh: rank, safetyTrips: 0, ...over },
    ...extra,
  };
}

const rows = [row(1, "Ada Brook", { settlingTimeS: null }), row(2, "Ben Carter"), row(3, "Cleo Dunn", { recoveryTimeS: null }), row(4, "Dev Eames")];
const labels = (rs: StandingsRow[]) => rs.map((r) => r.traineeLabel);

describe("sortStandings", () => {
  it("sorts by rank and by score (higher first on the first click)", () => {
    expect(labels(sortStandings([...rows].reverse(), { key: "rank", direction: "asc" }))).toEqual(["Ada Brook", "Ben Carter", "Cleo Dunn", "Dev Eames"]);
    expect(defaultDirection("score")).toBe("desc");
    expect(defaultDirection("settlingTimeS")).toBe("asc");
    expect(labels(sortStandings(rows, { key: "score", direction: "asc" }))).toEqual(["Dev Eames", "Cleo Dunn", "Ben Carter", "Ada Brook"]);
  });

  it("puts a never-settled attempt last whether ascending or descending", () => {
    expect(labels(sortStandings(rows, { key: "settlingTimeS", direction: "asc" }))).toEqual(["Ben Carter", "Cleo Dunn", "Dev Eames", "Ada Brook"]);
    expect(labels(sortStandings(rows, { key: "settlingTimeS", direction: "desc" }))).toEqual(["Dev Eames", "Cleo Dunn", "Ben Carter", "Ada Brook"]);
    expect(labels(sortStandings(rows, { key: "recoveryTimeS", direction: "desc" })).at(-1)).toBe("Cleo Dunn");
  });

  it("sorts trainees by name and submissions by time; ties keep rank order", () => {
    const mixed = [row(2, "bea"), row(1, "Al"), row(3, "Cy")];
    expect(labels(sortStandings(mixed, { key: "trainee", direction: "asc" }))).toEqual(["Al", "bea", "Cy"]);
    expect(labels(sortStandings(mixed, { key: "submittedAt", direction: "desc" }))).toEqual(["Cy", "bea", "Al"]);
    const tied = [row(3, "C", {}, { attemptsUsed: 2 }), row(1, "A", {}, { attemptsUsed: 2 }), row(2, "B", {}, { attemptsUsed: 1 })];
    expect(labels(sortStandings(tied, { key: "attemptsUsed", direction: "asc" }))).toEqual(["B", "A", "C"]);
  });

  it("does not change its input", () => {
    const copy = [...rows];
    sortStandings(rows, { key: "iae", direction: "desc" });
    expect(rows).toEqual(copy);
  });
});

describe("filterStandings", () => {
  const flagged = [row(1, "Ada Brook", {}, { flagged: true }), row(2, "Ben Carter", {}, { late: true }), row(3, "A. B.")];
  it("matches a case-insensitive substring of the label (names or initials)", () => {
    expect(labels(filterStandings(flagged, { text: "  bRoo " }))).toEqual(["Ada Brook"]);
    expect(labels(filterStandings(flagged, { text: "a. b" }))).toEqual(["A. B."]);
    expect(filterStandings(flagged, { text: "" })).toHaveLength(3);
  });
  it("hides flagged rows and keeps late rows only on request", () => {
    expect(labels(filterStandings(flagged, { hideFlagged: true }))).toEqual(["Ben Carter", "A. B."]);
    expect(labels(filterStandings(flagged, { lateOnly: true }))).toEqual(["Ben Carter"]);
  });
});
