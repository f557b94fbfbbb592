// The standings table against the route handler's contract (app/_lib/classroom/contracts.ts), with
// SWR's fetch replaced by a fetcher the test controls: sorting (nulls last, aria-sort), filtering,
// the best/all toggle asking for view=all, the own-rank view of a trainee, the flagged and late
// tags, and a refreshed response with a new row shown without a remount.
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import type { ReactNode } from "react";
import { SWRConfig } from "swr";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { StandingsResponse, StandingsRow } from "@/app/_lib/classroom/contracts";
import { StandingsTable } from "@/components/standings/StandingsTable";

vi.mock("next/link", () => ({ default: ({ href, children }: { href: string; children: ReactNode }) => <a href={href}>{children}</a> }));

function row(rank: number, label: string, over: Partial<StandingsRow["summary"]> = {}, extra: Partial<StandingsRow> = {}): StandingsRow {
  return {
    rank,
    attemptId: `00000000-0000-4000-8000-00000000000${rank}`,
    traineeLabel: label,
    isViewer: false,
    attemptNumber: 1,
    attemptsUsed: 1,
    submittedAt: "2026-11-20T10:00:00Z",
    late: false,
    flagged: false,
    summary: { score: 90 - rank * 10, rawScore: 90 - rank * 10, settlingTimeS: 100 * rank, overshootC: rank / 2, iae: 1000 * rank, recoveryTimeS: 60 * rank, energyKWh: 0.5 * rank, safetyTrips: 0, ...over },
    ...extra,
  };
}

function response(rows: StandingsRow[], over: Partial<StandingsResponse> = {}): StandingsResponse {
  return {
    assignment: { id: "a1", title: "Ladder", visibility: "names", dueAt: "2026-12-01T00:00:00Z", attemptLimit: 3, timeZone: "UTC", windowKinds: { setpoint: true, disturbance: true } },
    viewer: { staff: true },
    view: "best",
    rankedTrainees: rows.length,
    verifying: 0,
    rows,
    generatedAt: "2026-11-20T10:15:30Z",
    ...over,
  };
}

const base = [row(1, "Ada Brook", { settlingTimeS: null }), row(2, "Ben Carter", {}, { late: true }), row(3, "Cleo Dunn", {}, { flagged: true })];

/** A fresh SWR cache per test; the route handler is replaced by `fetcher` (through a stubbed fetch). */
function withFetcher(fetcher: (url: string) => Promise<unknown>) {
  vi.stubGlobal("fetch", async (url: string) => new Response(JSON.stringify(await fetcher(String(url))), { status: 200, headers: { "content-type": "application/json" } }));
  return ({ children }: { children: ReactNode }) => <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>{children}</SWRConfig>;
}

const labelsShown = () => screen.getAllByTestId("standings-row").map((r) => within(r).getAllByRole("cell")[1].textContent ?? "");

afterEach(() => vi.unstubAllGlobals());

describe("StandingsTable", () => {
  it("shows the rows with tags, links, units and 'not settled'; sorts by a header with nulls last", async () => {
    render(<StandingsTable assignmentId="a1" initial={response(base)} refreshMs={0} csvHref="/api/assignments/a1/standings/csv" />, { wrapper: withFetcher(async () => response(base)) });
    const rows = screen.getAllByTestId("standings-row");
    expect(rows).toHaveLength(3);
    expect(within(rows[0]).getByText("not settled")).toBeTruthy();
    expect(within(rows[1]).getByTestId("tag-late")).toBeTruthy();
    expect(within(rows[2]).getByTestId("tag-flagged").className).toContain("alarm-soft");
    expect(within(rows[1]).getByRole("link", { name: "Ben Carter" }).getAttribute("href")).toBe("/attempts/00000000-0000-4000-8000-000000000002");
    expect(within(rows[1]).getByText("2000 °C·s")).toBeTruthy();
    expect(screen.getByRole("link", { name: "Export CSV" }).getAttribute("href")).toBe("/api/assignments/a1/standings/csv");
    expect(screen.getByText("updated 10:15:30", { exact: false })).toBeTruthy();

    const settling = screen.getByRole("button", { name: /Settling/ });
    fireEvent.click(settling);
    expect(settling.closest("th")!.getAttribute("aria-sort")).toBe("ascending");
    expect(labelsShown().map((l) => l.split(/late|flagged/)[0])).toEqual(["Ben Carter", "Cleo Dunn", "Ada Brook"]);
    fireEvent.click(settling);
    expect(settling.closest("th")!.getAttribute("aria-sort")).toBe("descending");
    expect(labelsShown()[0]).toContain("Cleo Dunn");
    expect(labelsShown()[2]).toContain("Ada Brook"); // never settled: last both ways
    fireEvent.click(screen.getByRole("button", { name: /Score/ }));
    expect(screen.getByRole("button", { name: /Score/ }).closest("th")!.getAttribute("aria-sort")).toBe("descending");
    expect(labelsShown()[0]).toContain("Ada Brook");
  });

  it("filters by trainee text, hides flagged rows and keeps late rows only (staff)", () => {
    render(<StandingsTable assignmentId="a1" initial={response(base)} refreshMs={0} />, { wrapper: withFetcher(async () => response(base)) });
    fireEvent.change(screen.getByRole("searchbox", { name: "Filter by trainee" }), { target: { value: "cle" } });
    expect(labelsShown()).toHaveLength(1);
    expect(labelsShown()[0]).toContain("Cleo Dunn");
    fireEvent.change(screen.getByRole("searchbox", { name: "Filter by trainee" }), { target: { value: "" } });
    fireEvent.click(screen.getByRole("checkbox", { name: "hide flagged" }));
    expect(labelsShown().join("|")).not.toContain("Cleo");
    fireEvent.click(screen.getByRole("checkbox", { name: "hide flagged" }));
    fireEvent.click(screen.getByRole("checkbox", { name: "late only" }));
    expect(labelsShown()).toHaveLength(1);
    expect(labelsShown()[0]).toContain("Ben Carter");
  });

  it("asks for view=all when toggled and shows the attempts of that view", async () => {
    const urls: string[] = [];
    const all = response([row(1, "Ada Brook", {}, { attemptNumber: 2 }), row(2, "Ada Brook", {}, { attemptNumber: 1 }), ...base.slice(1)], { view: "all" });
    const fetcher = async (url: string) => {
      urls.push(url);
      return url.endsWith("view=all") ? all : response(base);
    };
    render(<StandingsTable assignmentId="a1" initial={response(base)} refreshMs={0} />, { wrapper: withFetcher(fetcher) });
    fireEvent.click(screen.getByRole("button", { name: "All attempts" }));
    await waitFor(() => expect(screen.getAllByTestId("standings-row")).toHaveLength(4));
    expect(urls).toContain("/api/assignments/a1/standings?view=all");
    expect(screen.getByRole("button", { name: "All attempts" }).getAttribute("aria-pressed")).toBe("true");
    expect(screen.getByText("Ada Brook · attempt 2")).toBeTruthy();
  });

  it("for a trainee under own-rank visibility shows 'Your rank: R of N' and their row only; no staff filters", () => {
    const mine = response([row(4, "You", {}, { isViewer: true })], { viewer: { staff: false }, rankedTrainees: 12, assignment: { ...response([]).assignment, visibility: "own-rank" } });
    render(<StandingsTable assignmentId="a1" initial={mine} refreshMs={0} />, { wrapper: withFetcher(async () => mine) });
    expect(screen.getByTestId("standings-own-rank").textContent).toBe("Your rank: 4 of 12");
    expect(screen.getAllByTestId("standings-row")).toHaveLength(1);
    expect(screen.getByTestId("standings-row").getAttribute("data-viewer")).toBe("true");
    expect(screen.queryByRole("checkbox", { name: "hide flagged" })).toBeNull();
    expect(screen.queryByRole("columnheader")).toBeNull();
  });

  it("shows a new verified attempt from a refreshed response without a remount, and the verifying count", async () => {
    let current = response(base.slice(0, 2), { verifying: 1 });
    const fetcher = vi.fn(async () => current);
    render(<StandingsTable assignmentId="a1" initial={current} refreshMs={30} />, { wrapper: withFetcher(fetcher) });
    expect(screen.getAllByTestId("standings-row")).toHaveLength(2);
    expect(screen.getByTestId("standings-verifying").textContent).toBe("1 attempt verifying…");
    const table = screen.getByTestId("standings-table");
    act(() => {
      current = response(base, { verifying: 0, generatedAt: "2026-11-20T10:16:00Z" });
    });
    await waitFor(() => expect(screen.getAllByTestId("standings-row")).toHaveLength(3));
    expect(screen.getByTestId("standings-table")).toBe(table); // same element: not remounted
    expect(screen.queryByTestId("standings-verifying")).toBeNull();
    expect(screen.getByText("Cleo Dunn")).toBeTruthy();
  });
});

describe("columns without their windows", () => {
  it("shows a dash, not 'not recovered', when the drill has no disturbance window", async () => {
    const row = { rank: 1, attemptId: "x1", traineeLabel: "Ada Quinn", isViewer: false, attemptNumber: 1, attemptsUsed: 1, submittedAt: "2026-11-30T10:00:00Z", late: false, flagged: false, summary: { score: 50, rawScore: 50, settlingTimeS: 300, overshootC: 0.4, iae: 900, recoveryTimeS: null, energyKWh: 0.5, safetyTrips: 0 } };
    const data = response([row]);
    data.assignment.windowKinds = { setpoint: true, disturbance: false };
    render(
      <SWRConfig value={{ provider: () => new Map(), fetcher: async () => data, dedupingInterval: 0 }}>
        <StandingsTable assignmentId="a1" initial={data} refreshMs={0} />
      </SWRConfig>,
    );
    const cells = within(screen.getAllByTestId("standings-row")[0]).getAllByRole("cell").map((c) => c.textContent);
    expect(cells).not.toContain("not recovered");
    expect(cells).toContain("—");
  });
});
