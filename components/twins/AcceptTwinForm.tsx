"use client";
/**
 * Accepting a candidate: which model, the twin's name and description, the ambient during the
 * test (optional; without it the PV before the step is used) and sharing. The original File goes
 * to the server with the mapping; the server reads and identifies it again and saves nothing
 * unless all of it holds.
 */
import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import type { LogMapping } from "@/sim/import";
import { kindLabel } from "./model-format";

export type AcceptTwinAction = (previous: null, form: FormData) => Promise<{ ok: true; message: string; id: string } | { ok: false; error: string }>;

const input = "w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2 text-ink";

export function AcceptTwinForm({
  file,
  mapping,
  preferred,
  hasSopdt,
  defaultName,
  action,
}: {
  file: File;
  mapping: LogMapping;
  preferred: "fopdt" | "sopdt";
  hasSopdt: boolean;
  defaultName: string;
  action: AcceptTwinAction;
}) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const submit = (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    form.set("file", file, file.name);
    form.set("mapping", JSON.stringify(mapping));
    form.set("shared", form.get("shared") ? "true" : "false");
    setError(null);
    startTransition(async () => {
      const r = await action(null, form);
      if (!r.ok) {
        setError(r.error);
        return;
      }
      setDone(r.message);
      router.push(`/twins/${r.id}`);
    });
  };

  return (
    <form onSubmit={submit} className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4" data-testid="accept-twin-form">
      <h2 className="text-base font-semibold">Accept as a twin</h2>
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="mb-1 font-medium text-ink-soft">Model</legend>
        {(["fopdt", "sopdt"] as const).map((k) => (
          <label key={k} className={`flex items-center gap-2 ${k === "sopdt" && !hasSopdt ? "text-ink-faint" : ""}`}>
            <input type="radio" name="choice" value={k} defaultChecked={k === preferred} disabled={k === "sopdt" && !hasSopdt} />
            {kindLabel(k)}
            {k === preferred ? <span className="text-xs text-ink-faint">(better fit)</span> : null}
          </label>
        ))}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block text-sm">
          <span className="mb-1 block font-medium text-ink-soft">Name</span>
          <input name="name" required maxLength={120} defaultValue={defaultName} className={input} />
        </label>
        <label className="block text-sm">
          <span className="mb-1 block font-medium text-ink-soft">Ambient during the test</span>
          <span className="flex items-center gap-2">
            <input name="ambientC" inputMode="decimal" placeholder="PV before the step" className={input} />
            <span className="num text-ink-faint">°C</span>
          </span>
          <span className="mt-1 block text-xs text-ink-faint">Optional, in °C (also for a °F log). Left empty, the PV before the step is taken as ambient.</span>
        </label>
      </div>
      <label className="block text-sm">
        <span className="mb-1 block font-medium text-ink-soft">Description</span>
        <textarea name="description" maxLength={4000} rows={2} className={input} placeholder="Where and how the test was made" />
      </label>
      <label className="flex items-center gap-2 text-sm text-ink-soft">
        <input type="checkbox" name="shared" /> share within my organisation (read-only to others)
      </label>
      {error ? (
        <p role="alert" data-testid="form-error" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-sm text-alarm">
          {error}
        </p>
      ) : null}
      {done ? (
        <p role="status" className="rounded-sm border border-ok/40 bg-paper px-3 py-2 text-sm text-ok">
          {done} Opening it…
        </p>
      ) : null}
      <button type="submit" disabled={pending} className="rounded-sm bg-ink px-4 py-2 text-sm font-medium text-paper hover:bg-ink-soft disabled:opacity-60">
        {pending ? "Saving — the server checks the file again…" : "Save twin"}
      </button>
    </form>
  );
}
