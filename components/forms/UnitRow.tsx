import type { ReactNode } from "react";

/** A labelled input on one row: the label on the left, the input and its unit on the right (the Bench's test panels). */
export function UnitRow({ id, label, unit, children }: { id: string; label: string; unit: string; children: ReactNode }) {
  return (
    <div className="flex items-center justify-between gap-2">
      <label htmlFor={id} className="text-ink-soft">
        {label}
      </label>
      <span className="flex items-center gap-1">
        {children}
        <span className="num w-8 text-ink-faint">{unit}</span>
      </span>
    </div>
  );
}
