import type { InputHTMLAttributes } from "react";

/** A labelled input in the instrument style: label above, hairline box, optional unit and hint. */
export function Field({
  label,
  name,
  hint,
  unit,
  ...input
}: { label: string; name: string; hint?: string; unit?: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className="block text-sm">
      <span className="mb-1 block font-medium text-ink-soft">{label}</span>
      <span className="flex items-center gap-2">
        <input
          name={name}
          id={name}
          className="w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2 text-ink placeholder:text-ink-faint focus:border-ink"
          {...input}
        />
        {unit ? <span className="num text-ink-faint">{unit}</span> : null}
      </span>
      {hint ? <span className="mt-1 block text-xs text-ink-faint">{hint}</span> : null}
    </label>
  );
}

export function SelectField({
  label,
  name,
  options,
  defaultValue,
}: {
  label: string;
  name: string;
  options: { value: string; label: string }[];
  defaultValue?: string;
}) {
  return (
    <label className="block text-sm">
      <span className="mb-1 block font-medium text-ink-soft">{label}</span>
      <select
        name={name}
        id={name}
        defaultValue={defaultValue}
        className="w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2 text-ink"
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}
