/// <reference lib="webworker" />
/**
 * The bump-test identification off the main thread: a long log takes a second or more to fit
 * (app/_lib/twins/fit-record.ts), which would freeze the page. The same pipeline the server runs.
 */
import { identifyLog } from "@/app/_lib/twins/identify-log";
import type { IdentifyReply, IdentifyRequest } from "./identify-protocol";

declare const self: DedicatedWorkerGlobalScope;

self.onmessage = (e: MessageEvent<IdentifyRequest>) => {
  const { id, text, byteSize, mapping } = e.data;
  const t0 = performance.now();
  let reply: IdentifyReply;
  try {
    const r = identifyLog(text, byteSize, mapping);
    const elapsedMs = performance.now() - t0;
    reply = r.ok ? { id, ok: true, identification: r.identification, summary: r.summary, fitNote: r.fitNote, elapsedMs } : { id, ok: false, message: r.message, elapsedMs };
  } catch (err) {
    reply = { id, ok: false, message: `The identification failed: ${err instanceof Error ? err.message : String(err)}`, elapsedMs: performance.now() - t0 };
  }
  self.postMessage(reply);
};
