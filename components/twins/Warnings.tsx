/** The identification's warnings, in the caution tone (not alarms: the model may still be usable). */
import { asSentence } from "@/app/_lib/twins/identify-log";

export function Warnings({ warnings }: { warnings: { code: string; message: string }[] }) {
  if (warnings.length === 0) return <p className="text-sm text-ink-soft">No warnings from the identification.</p>;
  return (
    <ul className="space-y-1 rounded-sm border border-caution/40 bg-caution-soft px-3 py-2 text-sm text-caution" data-testid="identify-warnings">
      {warnings.map((w, i) => (
        <li key={`${w.code}-${i}`}>{asSentence(w.message)}</li>
      ))}
    </ul>
  );
}
