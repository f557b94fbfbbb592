// Component test (Testing Library in jsdom) of the drill builder's event timeline: add an event,
// move it by editing its time, delete it, and an invalid duration shows a message and is not
// passed on as a valid event. What counts as valid is the engine's drillEventSchema
// (sim/drill/schema.ts: durations are positive, events not after the drill's end); the editor's
// messages are ours.
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import type { ReactNode } from "react";
import { SWRConfig } from "swr";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { ActionResult } from "@/app/_lib/action";
import { TimelineEditor } from "@/components/drills/TimelineEditor";
import { starterDocument } from "@/components/drills/starters";
import type { DrillDetail, DrillVersionDocument } from "@/db/drill-queries";
import { drillEventSchema, drillSchema, type DrillEvent } from "@/sim/drill/schema";

vi.mock("next/navigation", () => ({ useRouter: () => ({ replace: vi.fn(), refresh: vi.fn(), push: vi.fn() }) }));
vi.mock("uplot", () => ({ default: class { destroy() {} } }));
const { DrillBuilder } = await import("@/components/drills/DrillBuilder");

const setup = (events: DrillEvent[] = [], durationS = 3600) => {
  const onChange = vi.fn<(events: DrillEvent[], allValid: boolean) => void>();
  render(<TimelineEditor events={events} durationS={durationS} onChange={onChange} />);
  const last = () => onChange.mock.calls.at(-1)!;
  return { onChange, last };
};

const rows = () => screen.queryAllByTestId("timeline-row");

describe("TimelineEditor", () => {
  it("adds an event of the chosen type with its size and duration in units", () => {
    const { last } = setup();
    fireEvent.change(screen.getByLabelText("New event type"), { target: { value: "inlet-blockage" } });
    fireEvent.click(screen.getByRole("button", { name: "Add event" }));
    expect(rows()).toHaveLength(1);
    const row = within(rows()[0]);
    expect(row.getByLabelText("Event 1 type")).toHaveProperty("value", "inlet-blockage");
    expect(row.getByText("%")).toBeTruthy();
    expect(row.getAllByText("s").length).toBeGreaterThan(0);
    const [events, valid] = last();
    expect(valid).toBe(true);
    expect(events).toEqual([{ type: "inlet-blockage", timeS: 300, percent: 50, durationS: 900 }]);
    // the event is what the engine accepts
    expect(drillEventSchema.parse(events[0])).toEqual(events[0]);
  });

  it("moves an event by editing its time, keeping the emitted timeline in time order", () => {
    const { last } = setup([
      { type: "setpoint", timeS: 300, setpointC: 70 },
      { type: "door-open", timeS: 1200, durationS: 120 },
    ]);
    fireEvent.change(screen.getByLabelText("Event 1 time"), { target: { value: "1500" } });
    const [events, valid] = last();
    expect(valid).toBe(true);
    expect(events.map((e) => [e.type, e.timeS])).toEqual([
      ["door-open", 1200],
      ["setpoint", 1500],
    ]);
    expect(within(rows()[0]).getByText("25:00")).toBeTruthy();
    // leaving the field sorts the rows too
    fireEvent.blur(screen.getByLabelText("Event 1 time"));
    expect(within(rows()[0]).getByLabelText("Event 1 type")).toHaveProperty("value", "door-open");
  });

  it("deletes an event", () => {
    const { last } = setup([
      { type: "setpoint", timeS: 300, setpointC: 70 },
      { type: "ambient", timeS: 900, temperatureC: 8 },
    ]);
    fireEvent.click(screen.getByRole("button", { name: "Delete event 1" }));
    expect(rows()).toHaveLength(1);
    expect(last()).toEqual([[{ type: "ambient", timeS: 900, temperatureC: 8 }], true]);
  });

  it("shows a message for an invalid duration and passes the row on as invalid", () => {
    const { last } = setup([{ type: "door-open", timeS: 600, durationS: 120 }]);
    fireEvent.change(screen.getByLabelText("Event 1 duration"), { target: { value: "-30" } });
    expect(screen.getByRole("alert").textContent).toBe("Duration must be more than 0 s.");
    expect(last()).toEqual([[], false]);
    fireEvent.change(screen.getByLabelText("Event 1 duration"), { target: { value: "" } });
    expect(screen.getByRole("alert").textContent).toBe("Duration is required.");
    fireEvent.change(screen.getByLabelText("Event 1 duration"), { target: { value: "240" } });
    expect(screen.queryByRole("alert")).toBeNull();
    expect(last()).toEqual([[{ type: "door-open", timeS: 600, durationS: 240 }], true]);
  });

  it("refuses an event after the end of the drill and a size outside the engine's range", () => {
    const { last } = setup([{ type: "inlet-blockage", timeS: 600, percent: 40 }], 1800);
    fireEvent.change(screen.getByLabelText("Event 1 time"), { target: { value: "2400" } });
    expect(screen.getByRole("alert").textContent).toBe("Time is after the end of the drill (1800 s).");
    fireEvent.change(screen.getByLabelText("Event 1 time"), { target: { value: "900" } });
    fireEvent.change(screen.getByLabelText("Event 1 blocked"), { target: { value: "140" } });
    expect(screen.getByRole("alert").textContent).toMatch(/^Blocked: /);
    expect(last()[1]).toBe(false);
  });
});

// ---- the same editor inside the drill builder: what Save posts ----

const drillId = "3c9e1f52-8b7d-4e0a-9a6f-2d4b1c8e7f30";
const now = "2026-12-01T09:00:00.000Z";
const detail: DrillDetail = {
  id: drillId,
  title: "Step on C-2",
  ownerName: "Marcus Okafor",
  mine: true,
  sharedWithOrg: false,
  archivedAt: null,
  createdAt: now,
  updatedAt: now,
  status: "draft",
  latestVersion: 1,
  draftVersion: 1,
  publishedVersions: [],
  lastPublishedAt: null,
  versions: [{ version: 1, status: "draft", publishedAt: null, createdAt: now, createdByName: "Marcus Okafor" }],
};
const current: DrillVersionDocument = { drillId, version: 1, status: "draft", publishedAt: null, document: drillSchema.parse(starterDocument("setpoint-step", drillId, "Step on C-2")) };

describe("the timeline in the drill builder", () => {
  afterEach(() => vi.unstubAllGlobals());

  const saveDraft = vi.fn(async (_p: ActionResult, _f: FormData): Promise<ActionResult> => ({ ok: true, message: "Draft version 1 saved." }));
  const other = async (): Promise<ActionResult> => ({ ok: true });
  const renderBuilder = () => {
    vi.stubGlobal(
      "fetch",
      vi.fn(async (url: string) => new Response(JSON.stringify(url === "/api/plants" ? { plants: [] } : { drill: detail }), { status: 200, headers: { "content-type": "application/json" } })),
    );
    const fresh = ({ children }: { children: ReactNode }) => <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>{children}</SWRConfig>;
    render(
      <DrillBuilder drill={detail} current={current} actions={{ saveDraft: (p, f) => saveDraft(p, f), publishDraft: other, newDraftFromPublished: other, duplicateDrill: other, setDrillShared: other, archiveDrill: other }} />,
      { wrapper: fresh },
    );
  };

  it("saves the added event in the drill document, valid for the engine; an invalid duration blocks saving", async () => {
    renderBuilder();
    expect(screen.getByTestId("score-formula").textContent).toContain("100/(1 + C)");
    const save = screen.getByRole("button", { name: "Save draft v1" }) as HTMLButtonElement;
    expect(save.disabled).toBe(true); // nothing changed yet
    fireEvent.change(screen.getByLabelText("New event type"), { target: { value: "door-open" } });
    fireEvent.click(screen.getByRole("button", { name: "Add event" }));
    fireEvent.change(screen.getByLabelText("Event 2 duration"), { target: { value: "0" } });
    expect(within(screen.getAllByTestId("timeline-row")[1]).getByRole("alert").textContent).toBe("Duration must be more than 0 s.");
    expect(save.disabled).toBe(true);
    expect(save.title).toBe("Fix the timeline first.");
    fireEvent.change(screen.getByLabelText("Event 2 duration"), { target: { value: "90" } });
    expect(save.disabled).toBe(false);
    fireEvent.click(save);
    await waitFor(() => expect(saveDraft).toHaveBeenCalledTimes(1));
    const form = saveDraft.mock.calls[0][1];
    expect(form.get("drillId")).toBe(drillId);
    const posted = drillSchema.parse(JSON.parse(String(form.get("payload"))));
    expect(posted.events).toEqual([
      { type: "setpoint", timeS: 300, setpointC: current.document.events[0].type === "setpoint" ? current.document.events[0].setpointC : NaN },
      { type: "door-open", timeS: 600, durationS: 90 },
    ]);
    await screen.findByText("Draft version 1 saved.");
  });
});
