/** A navigation section whose pages are not built in this installation yet. */
export function SectionNotOpen({ title, description }: { title: string; description: string }) {
  return (
    <section className="max-w-2xl">
      <h1 className="mb-2 text-xl font-semibold">{title}</h1>
      <p className="text-sm text-ink-soft">{description}</p>
      <p className="mt-4 rounded-sm border border-rule bg-paper-raised px-4 py-3 text-sm text-ink-soft">This section is not open yet in this installation.</p>
    </section>
  );
}
