"use client";
/** Small instrument-style inputs for the drill builder: a number with its unit (text kept while
 * typing; NaN passed on when it is not a number, so the engine's schema names the field), a
 * select, a checkbox and a section frame. */
import { useEffect, useId, useState, type ReactNode } from "react";

export function Num({
  label,
  unit,
  value,
  onValue,
  optional = false,
  placeholder,
  disabled,
  hint,
  width = "w-24",
}: {
  label: string;
  unit?: string;
  value: number | undefined;
  onValue: (v: number | undefined) => void;
  optional?: boolean;
  placeholder?: string;
  disabled?: boolean;
  hint?: string;
  width?: string;
}) {
  const id = useId();
  const [text, setText] = useState(value === undefined || Number.isNaN(value) ? "" : String(value));
  useEffect(() => {
    setText((t) => {
      const shown = t.trim() === "" ? undefined : Number(t);
      if (shown === value || (Number.isNaN(shown) && Number.isNaN(value))) return t;
      return value === undefined || Number.isNaN(value) ? "" : String(value);
    });
  }, [value]);
  const trimmed = text.trim();
  const bad = trimmed === "" ? !optional : !Number.isFinite(Number(trimmed));
  return (
    <div className="flex items-center justify-between gap-2 text-sm">
      <label htmlFor={id} className="text-ink-soft" title={hint}>
        {label}
      </label>
      <span className="flex items-center gap-1.5">
        <input
          id={id}
          inputMode="decimal"
          value={text}
          disabled={disabled}
          placeholder={placeholder ?? (optional ? "—" : undefined)}
          aria-invalid={bad ? true : undefined}
          onChange={(e) => {
            setText(e.target.value);
            const t = e.target.value.trim();
            onValue(t === "" ? (optional ? undefined : Number.NaN) : Number.isFinite(Number(t)) ? Number(t) : Number.NaN);
          }}
          className={`num ${width} rounded-sm border bg-paper px-1.5 py-1 text-right ${bad ? "border-alarm" : "border-rule-strong"} disabled:bg-paper-sunk`}
        />
        <span className="num w-20 text-xs text-ink-faint">{unit ?? ""}</span>
      </span>
    </div>
  );
}

export function Choice<T extends string>({ label, value, options, onChange, disabled }: { label: string; value: T; options: [T, string][]; onChange: (v: T) => void; disabled?: boolean }) {
  const id = useId();
  return (
    <div className="flex items-center justify-between gap-2 text-sm">
      <label htmlFor={id} className="text-ink-soft">
        {label}
      </label>
      <select id={id} value={value} disabled={disabled} onChange={(e) => onChange(e.target.value as T)} className="w-48 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-sm">
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </div>
  );
}

export function Check({ label, checked, onChange, disabled }: { label: string; checked: boolean; onChange: (v: boolean) => void; disabled?: boolean }) {
  return (
    <label className="flex items-center justify-between gap-2 text-sm">
      <span className="text-ink-soft">{label}</span>
      <input type="checkbox" checked={checked} disabled={disabled} onChange={(e) => onChange(e.target.checked)} />
    </label>
  );
}

export function Section({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <section className="space-y-2 border-t border-rule pt-3" aria-label={title}>
      <div className="flex items-baseline justify-between gap-2">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{title}</h2>
        {aside}
      </div>
      {children}
    </section>
  );
}
