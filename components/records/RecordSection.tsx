import type { ReactNode } from "react";

/** One section of the record document: a small heading over a hairline, kept together in print. */
export function RecordSection({ title, children, className = "" }: { title: string; children: ReactNode; className?: string }) {
  return (
    <section className={`record-section break-inside-avoid space-y-2 ${className}`}>
      <h2 className="border-b border-rule pb-1 text-sm font-semibold uppercase tracking-wide text-ink-soft print:text-black">{title}</h2>
      {children}
    </section>
  );
}
