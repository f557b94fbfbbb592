/** The header row of Loopwright's data tables: small caps labels over a strong rule. */
export function TableHead({ columns }: { columns: string[] }) {
  return (
    <thead>
      <tr className="border-b border-rule-strong text-left text-xs uppercase tracking-wide text-ink-faint">
        {columns.map((c, i) => (
          <th key={`${c}-${i}`} className="py-2 font-medium">
            {c}
          </th>
        ))}
      </tr>
    </thead>
  );
}
