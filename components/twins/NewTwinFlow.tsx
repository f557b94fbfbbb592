"use client";
/**
 * The new-twin page: file → mapping (re-read on every change) → Identify (in a worker, with
 * progress and Cancel) → candidates side by side → accept. Nothing is saved before the last step,
 * and the server then checks everything again from the original file.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import { guessMappingForText, logMappingSchema, type LogMapping } from "@/sim/import";
import { AcceptTwinForm, type AcceptTwinAction } from "./AcceptTwinForm";
import { FileDrop, type LoadedLog } from "./FileDrop";
import { IdentifyResults } from "./IdentifyResults";
import type { LogReading } from "./log-reading";
import { MappingStep } from "./MappingStep";
import { byteSizeText } from "./model-format";
import { useIdentify, type WorkerFactory } from "./use-identify";

interface Loaded extends LoadedLog {
  key: number;
  initialMapping: LogMapping;
  guessNote: string | null;
}

const FALLBACK_MAPPING = logMappingSchema.parse({ columns: { time: 0, out: 1, pv: 2 } });

function Elapsed({ since }: { since: number }) {
  const [now, setNow] = useState(() => performance.now());
  useEffect(() => {
    const id = setInterval(() => setNow(performance.now()), 250);
    return () => clearInterval(id);
  }, []);
  return <span className="num">{((now - since) / 1000).toFixed(1)} s</span>;
}

export function NewTwinFlow({ action, workerFactory }: { action: AcceptTwinAction; workerFactory?: WorkerFactory }) {
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [fileRefusal, setFileRefusal] = useState<string | null>(null);
  const [current, setCurrent] = useState<{ mapping: LogMapping; reading: LogReading } | null>(null);
  const identified = useRef<LogMapping | null>(null);
  const keys = useRef(0);
  const { state, run, cancel } = useIdentify(workerFactory);

  const onLoaded = (log: LoadedLog) => {
    cancel();
    setFileRefusal(null);
    setCurrent(null);
    const guess = guessMappingForText(log.text);
    setLoaded({
      ...log,
      key: ++keys.current,
      initialMapping: guess.ok ? guess.mapping : FALLBACK_MAPPING,
      guessNote: guess.ok ? null : "The columns could not be guessed: set them below.",
    });
  };

  const onReading = useCallback(
    (mapping: LogMapping, reading: LogReading) => {
      setCurrent({ mapping, reading });
      // a changed mapping makes any earlier identification stale
      if (identified.current && identified.current !== mapping) {
        identified.current = null;
        cancel();
      }
    },
    [cancel],
  );

  const identify = () => {
    if (!loaded || !current?.reading.result.ok) return;
    identified.current = current.mapping;
    run(loaded.text, loaded.file.size, current.mapping);
  };

  const readOk = current?.reading.result.ok ? current.reading.result : null;
  const baseName = loaded?.file.name.replace(/\.[^.]*$/, "") ?? "log";

  return (
    <div className="space-y-6">
      <section className="space-y-2" aria-label="Choose the log">
        <FileDrop onLoaded={onLoaded} onRefused={(m) => setFileRefusal(m)} />
        {fileRefusal ? (
          <p role="alert" data-testid="file-refusal" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-sm text-alarm">
            {fileRefusal} Nothing has been saved.
          </p>
        ) : null}
        {loaded ? (
          <p className="text-sm text-ink-soft">
            <span className="font-medium text-ink">{loaded.file.name}</span> · <span className="num">{byteSizeText(loaded.file.size)}</span> · read as {loaded.encoding}
            {loaded.guessNote ? <span className="ml-2 text-caution">{loaded.guessNote}</span> : null}
          </p>
        ) : null}
      </section>

      {loaded ? (
        <MappingStep key={loaded.key} text={loaded.text} byteSize={loaded.file.size} fileName={loaded.file.name} initialMapping={loaded.initialMapping} onReading={onReading} />
      ) : null}

      {loaded && readOk ? (
        <section className="space-y-3" aria-label="Identify">
          <div className="flex flex-wrap items-center gap-3">
            <button
              type="button"
              onClick={identify}
              disabled={state.status === "running"}
              className="rounded-sm bg-ink px-4 py-2 text-sm font-medium text-paper hover:bg-ink-soft disabled:opacity-60"
            >
              Identify
            </button>
            {state.status === "running" ? (
              <>
                <span role="status" className="text-sm text-ink-soft">
                  Identifying… <Elapsed since={state.startedAt} />
                </span>
                <button type="button" onClick={cancel} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm hover:border-ink">
                  Cancel
                </button>
              </>
            ) : null}
            {state.status === "done" ? (
              <span className="text-xs text-ink-faint">
                Identified in <span className="num">{(state.reply.elapsedMs / 1000).toFixed(1)} s</span> (FOPDT and SOPDT output-error fits).
              </span>
            ) : null}
          </div>
          {state.status === "refused" ? (
            <p role="alert" data-testid="identify-refusal" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-sm text-alarm">
              {state.message} Nothing has been saved.
            </p>
          ) : null}
          {state.status === "done" && identified.current === current?.mapping ? (
            <>
              <IdentifyResults identification={state.reply.identification} summary={state.reply.summary} log={readOk.log} fitNote={state.reply.fitNote} fileName={baseName} />
              <AcceptTwinForm
                file={loaded.file}
                mapping={current.mapping}
                preferred={state.reply.identification.preferred}
                hasSopdt={state.reply.identification.sopdt !== null}
                defaultName={baseName}
                action={action}
              />
            </>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
