"use client";
/**
 * Where the log comes in: drop it or pick it. The size is checked before a byte is read (the same
 * limit and words as the server); the bytes are decoded as the server will decode them.
 */
import { useRef, useState } from "react";
import { decodeLogBytes, type LogEncoding } from "@/app/_lib/twins/decode-log";
import { LIMIT_TEXT, sizeLimitMessage } from "@/app/_lib/twins/upload-limit";
import { MAX_UPLOAD_BYTES } from "@/sim/import";

export interface LoadedLog {
  file: File;
  text: string;
  encoding: LogEncoding;
}

export function FileDrop({ onLoaded, onRefused }: { onLoaded: (log: LoadedLog) => void; onRefused: (message: string) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  const [reading, setReading] = useState(false);

  const take = async (file: File | undefined) => {
    if (!file) return;
    if (file.size > MAX_UPLOAD_BYTES) return onRefused(sizeLimitMessage(file.size));
    if (file.size === 0) return onRefused("The file is empty: choose the CSV or TSV file the logger wrote.");
    setReading(true);
    try {
      const decoded = decodeLogBytes(new Uint8Array(await file.arrayBuffer()));
      if (!decoded.ok) return onRefused(decoded.message);
      onLoaded({ file, text: decoded.text, encoding: decoded.encoding });
    } catch (err) {
      onRefused(`The file could not be read: ${err instanceof Error ? err.message : String(err)}`);
    } finally {
      setReading(false);
    }
  };

  return (
    <div
      data-testid="file-drop"
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        void take(e.dataTransfer.files[0]);
      }}
      className={`rounded-sm border border-dashed px-4 py-6 text-center text-sm ${over ? "border-ink bg-paper-sunk" : "border-rule-strong bg-paper-raised"}`}
    >
      <p className="font-medium">Drop the bump-test log here</p>
      <p className="mt-1 text-ink-soft">
        or{" "}
        <button type="button" onClick={() => input.current?.click()} className="underline decoration-rule-strong hover:text-ink">
          choose a file
        </button>{" "}
        — CSV or tab-separated text, at most {LIMIT_TEXT}.
      </p>
      <input
        ref={input}
        type="file"
        aria-label="Log file"
        accept=".csv,.tsv,.txt,.log,text/csv,text/tab-separated-values,text/plain"
        className="sr-only"
        onChange={(e) => {
          void take(e.target.files?.[0]);
          e.target.value = ""; // choosing the same file again still reads it
        }}
      />
      {reading ? <p className="mt-2 text-xs text-ink-faint">Reading…</p> : null}
    </div>
  );
}
