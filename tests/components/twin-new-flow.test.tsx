// The new-twin flow end to end in jsdom: a file over the limit is refused before it is read; an
// example log (public/samples, invented data) is read, identified by a stand-in worker that runs
// the same pipeline synchronously, shown as two candidates, and accepted: the action receives the
// original File and the mapping, and the page goes to the new twin. uPlot is stubbed (no canvas).
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { readFileSync } from "node:fs";
import { describe, expect, it, vi } from "vitest";

vi.mock("uplot", () => ({ default: class { static sync = () => ({ key: "k" }); destroy() {} } }));
const push = vi.fn();
vi.mock("next/navigation", () => ({ useRouter: () => ({ push }) }));

import { identifyLog } from "@/app/_lib/twins/identify-log";
import { NewTwinFlow } from "@/components/twins/NewTwinFlow";
import type { IdentifyRequest } from "@/components/twins/identify-protocol";
import { MAX_UPLOAD_BYTES } from "@/sim/import";

/** Answers like identify.worker.ts, on the next tick. */
class FakeWorker {
  onmessage: ((e: MessageEvent) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  terminated = false;
  postMessage(req: IdentifyRequest) {
    setTimeout(() => {
      if (this.terminated) return;
      const r = identifyLog(req.text, req.byteSize, req.mapping);
      const data = r.ok ? { id: req.id, ok: true, identification: r.identification, summary: r.summary, fitNote: r.fitNote, elapsedMs: 1 } : { id: req.id, ok: false, message: r.message, elapsedMs: 1 };
      this.onmessage?.({ data } as MessageEvent);
    }, 0);
  }
  terminate() {
    this.terminated = true;
  }
}

function fileOf(bytes: Uint8Array<ArrayBuffer> | string, name: string): File {
  const f = new File([bytes], name, { type: "text/csv" });
  // jsdom's File lacks arrayBuffer in some versions: read through a Response
  if (typeof f.arrayBuffer !== "function") Object.defineProperty(f, "arrayBuffer", { value: () => new Response(f).arrayBuffer() });
  return f;
}

describe("NewTwinFlow", () => {
  it("refuses a file over the limit before reading it, stating the limit", async () => {
    render(<NewTwinFlow action={vi.fn()} workerFactory={() => new FakeWorker() as unknown as Worker} />);
    const big = fileOf("x", "huge.csv");
    Object.defineProperty(big, "size", { value: MAX_UPLOAD_BYTES + 1 });
    const read = vi.spyOn(big, "arrayBuffer");
    fireEvent.change(screen.getByLabelText("Log file"), { target: { files: [big] } });
    expect((await screen.findByTestId("file-refusal")).textContent).toMatch(/the limit is 2 MiB \(2,097,152 bytes\)/);
    expect(read).not.toHaveBeenCalled();
  });

  it("reads an example log, identifies it off the page, shows both candidates and posts the original file with the mapping", async () => {
    const bytes = readFileSync("public/samples/oven-bump-fahrenheit.tsv");
    const action = vi.fn(async () => ({ ok: true as const, message: "Twin saved.", id: "00000000-0000-4000-8000-000000000001" }));
    render(<NewTwinFlow action={action} workerFactory={() => new FakeWorker() as unknown as Worker} />);
    const file = fileOf(new Uint8Array(bytes), "oven-bump-fahrenheit.tsv");
    fireEvent.change(screen.getByLabelText("Log file"), { target: { files: [file] } });
    await screen.findByTestId("mapping-ok");
    // the guess: tab-separated, date-times, °F (the sample's README)
    expect((screen.getByLabelText("PV and SP in") as HTMLSelectElement).value).toBe("F");
    expect((screen.getByLabelText("Time written as") as HTMLSelectElement).value).toBe("timestamp");

    fireEvent.click(await screen.findByRole("button", { name: "Identify" }));
    expect(screen.getByText(/Identifying…/)).toBeTruthy();
    const results = await screen.findByTestId("identify-results", {}, { timeout: 20_000 });
    expect(within(results).getByTestId("candidate-fopdt").textContent).toMatch(/°C\/%/);
    expect(within(results).getByTestId("candidate-sopdt").textContent).toMatch(/τ2/);

    const form = screen.getByTestId("accept-twin-form");
    fireEvent.change(within(form).getByLabelText("Name"), { target: { value: "Cure oven PC-1" } });
    await act(async () => {
      fireEvent.submit(form);
    });
    await waitFor(() => expect(push).toHaveBeenCalledWith("/twins/00000000-0000-4000-8000-000000000001"));
    const sent = (action.mock.calls[0] as unknown as [null, FormData])[1];
    expect(sent.get("file")).toBeInstanceOf(File);
    expect((sent.get("file") as File).name).toBe("oven-bump-fahrenheit.tsv");
    expect(JSON.parse(String(sent.get("mapping")))).toMatchObject({ delimiter: expect.any(String), temperatureUnit: "F", timeFormat: "timestamp" });
    expect(sent.get("name")).toBe("Cure oven PC-1");
    expect(sent.get("shared")).toBe("false");
    expect(["fopdt", "sopdt"]).toContain(sent.get("choice"));
  }, 30_000);

  it("a change of mapping after identifying hides the stale candidates", async () => {
    const bytes = readFileSync("public/samples/cabinet-bump-decimal-comma.csv");
    render(<NewTwinFlow action={vi.fn()} workerFactory={() => new FakeWorker() as unknown as Worker} />);
    fireEvent.change(screen.getByLabelText("Log file"), { target: { files: [fileOf(new Uint8Array(bytes), "cabinet.csv")] } });
    await screen.findByTestId("mapping-ok");
    fireEvent.click(await screen.findByRole("button", { name: "Identify" }));
    await screen.findByTestId("identify-results", {}, { timeout: 20_000 });
    fireEvent.change(screen.getByLabelText("Decimal mark"), { target: { value: "." } });
    expect(screen.queryByTestId("identify-results")).toBeNull();
    expect(screen.getByTestId("mapping-refusal")).toBeTruthy();
  }, 30_000);
});
