// Small shared pieces of the Bench's plant and saved-work panels: number formatting (every number
// with its unit, in the monospaced `.num` face), and the JSON fetcher SWR uses.

/** Decimals by magnitude, so figures keep three or four significant digits; `digits` fixes them. */
export function formatNumber(value: number, digits?: number): string {
  if (!Number.isFinite(value)) return "—";
  const a = Math.abs(value);
  const d = digits ?? (a >= 100 ? 0 : a >= 10 ? 1 : a >= 1 ? 2 : a >= 0.01 ? 3 : a === 0 ? 0 : 4);
  return new Intl.NumberFormat("en-GB", { maximumFractionDigits: d, minimumFractionDigits: digits ?? 0 }).format(value);
}

/** A number and its unit, never split across lines. A missing value shows as a dash with the unit. */
export function Qty({ value, unit, digits, testId }: { value: number | null | undefined; unit: string; digits?: number; testId?: string }) {
  const text = value === null || value === undefined ? "—" : formatNumber(value, digits);
  return (
    <span className="num whitespace-nowrap" data-testid={testId}>
      {text}
      {unit ? `\u00a0${unit}` : ""}
    </span>
  );
}

/** Seconds, with minutes beside them once they help reading. */
export function Duration({ seconds, testId }: { seconds: number | null | undefined; testId?: string }) {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return <Qty value={null} unit="s" testId={testId} />;
  return (
    <span data-testid={testId}>
      <Qty value={seconds} unit="s" />
      {seconds >= 120 ? (
        <span className="text-ink-faint">
          {" "}
          (<Qty value={seconds / 60} unit="min" digits={1} />)
        </span>
      ) : null}
    </span>
  );
}

export async function fetchJson<T>(url: string): Promise<T> {
  const res = await fetch(url, { headers: { accept: "application/json" } });
  if (!res.ok) throw new Error(((await res.json().catch(() => ({}))) as { error?: string }).error ?? `HTTP ${res.status}`);
  return (await res.json()) as T;
}

export const dateTimeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
