import type { Figure } from "@/app/_lib/records/record-figures";

/** Labelled figures as a definition list: label left, value in the readout face. */
export function FigureList({ figures, testId }: { figures: Figure[]; testId?: string }) {
  return (
    <dl className="grid grid-cols-[minmax(8rem,12rem)_1fr] gap-x-4 gap-y-1 text-sm" data-testid={testId}>
      {figures.map((f) => (
        <div key={f.key} className="contents">
          <dt className="text-ink-soft">{f.label}</dt>
          <dd className="num break-words text-ink" data-figure={f.key}>
            {f.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}
