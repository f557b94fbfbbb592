"use client";
/**
 * How to read the log: which column is time, OUT, PV (and optionally SP and mode), how time is
 * written, the decimal mark, the temperature unit, the delimiter and whether the first line holds
 * names. Controlled: every change goes straight to onChange, and the page reads the file again.
 */
import type { LogMapping } from "@/sim/import";
import type { LogTable } from "@/sim/import";

type Columns = LogMapping["columns"];
type Role = keyof Columns;

const ROLES: { role: Role; label: string; optional: boolean }[] = [
  { role: "time", label: "Time column", optional: false },
  { role: "out", label: "OUT column (%)", optional: false },
  { role: "pv", label: "PV column", optional: false },
  { role: "sp", label: "SP column (optional)", optional: true },
  { role: "mode", label: "Mode column (optional)", optional: true },
];

const selectLook = "w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1.5 text-sm text-ink";

export function columnName(table: LogTable | null, i: number): string {
  const h = table?.headers?.[i];
  return h ? `${i + 1}: ${h}` : `column ${i + 1}`;
}

function Choice<T extends string>({ label, value, options, onChange, id }: { label: string; value: T; options: { value: T; label: string }[]; onChange: (v: T) => void; id: string }) {
  return (
    <label className="block text-sm" htmlFor={id}>
      <span className="mb-1 block font-medium text-ink-soft">{label}</span>
      <select id={id} className={selectLook} value={value} onChange={(e) => onChange(e.target.value as T)}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export function MappingForm({ mapping, table, onChange }: { mapping: LogMapping; table: LogTable | null; onChange: (m: LogMapping) => void }) {
  const chosen = Object.values(mapping.columns).filter((c): c is number => c !== null);
  const count = Math.max(table?.columnCount ?? 0, ...chosen.map((c) => c + 1), 3);
  const indices = Array.from({ length: count }, (_, i) => i);
  const setColumn = (role: Role, v: string) => onChange({ ...mapping, columns: { ...mapping.columns, [role]: v === "" ? null : Number(v) } });
  return (
    <fieldset className="space-y-3" data-testid="mapping-form">
      <legend className="mb-1 text-sm font-semibold">Columns</legend>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-5">
        {ROLES.map(({ role, label, optional }) => (
          <label key={role} className="block text-sm" htmlFor={`map-${role}`}>
            <span className="mb-1 block font-medium text-ink-soft">{label}</span>
            <select id={`map-${role}`} className={selectLook} value={mapping.columns[role] ?? ""} onChange={(e) => setColumn(role, e.target.value)}>
              {optional ? <option value="">none</option> : null}
              {indices.map((i) => (
                <option key={i} value={i}>
                  {columnName(table, i)}
                </option>
              ))}
            </select>
          </label>
        ))}
      </div>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-5">
        <Choice
          id="map-time-format"
          label="Time written as"
          value={mapping.timeFormat}
          options={[
            { value: "seconds", label: "seconds (elapsed)" },
            { value: "timestamp", label: "date and time" },
          ]}
          onChange={(timeFormat) => onChange({ ...mapping, timeFormat })}
        />
        <Choice
          id="map-decimal"
          label="Decimal mark"
          value={mapping.decimalMark}
          options={[
            { value: ".", label: "point (12.5)" },
            { value: ",", label: "comma (12,5)" },
          ]}
          onChange={(decimalMark) => onChange({ ...mapping, decimalMark })}
        />
        <Choice
          id="map-unit"
          label="PV and SP in"
          value={mapping.temperatureUnit}
          options={[
            { value: "C", label: "°C" },
            { value: "F", label: "°F (converted to °C)" },
          ]}
          onChange={(temperatureUnit) => onChange({ ...mapping, temperatureUnit })}
        />
        <Choice
          id="map-delimiter"
          label="Delimiter"
          value={mapping.delimiter}
          options={[
            { value: "auto", label: "find it" },
            { value: ",", label: "comma" },
            { value: ";", label: "semicolon" },
            { value: "\t", label: "tab" },
          ]}
          onChange={(delimiter) => onChange({ ...mapping, delimiter })}
        />
        <label className="flex items-end gap-2 pb-2 text-sm text-ink-soft">
          <input type="checkbox" checked={mapping.headerRow} onChange={(e) => onChange({ ...mapping, headerRow: e.target.checked })} />
          first line holds column names
        </label>
      </div>
    </fieldset>
  );
}
