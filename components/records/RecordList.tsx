import Link from "next/link";
import type { RecordList as RecordListData, RecordListFilter } from "@/app/_lib/records/record-queries";
import { TableHead } from "@/components/tables/TableHead";

const isoDate = (d: Date) => d.toISOString().slice(0, 10);

/** One filter of the list: a GET parameter with an "all" choice first. */
function FilterSelect({ label, name, value, all, options }: { label: string; name: string; value: string; all: string; options: { value: string; label: string }[] }) {
  return (
    <label className="text-sm">
      <span className="mb-1 block text-ink-soft">{label}</span>
      <select name={name} defaultValue={value} className="rounded-sm border border-rule-strong bg-paper-raised px-2 py-1.5 text-sm">
        <option value="">{all}</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

/** Filter selects as a plain GET form: the filter lives in the address, so it can be bookmarked. */
function RecordFilters({ data, filter }: { data: RecordListData; filter: RecordListFilter }) {
  return (
    <form method="get" className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter records">
      <FilterSelect label="Plant" name="plant" value={filter.plantRef ?? ""} all="All plants" options={data.plants.map((p) => ({ value: p.ref, label: p.name }))} />
      <FilterSelect label="Author" name="author" value={filter.ownerId ?? ""} all="All authors" options={data.authors.map((a) => ({ value: a.id, label: a.name }))} />
      <button type="submit" className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm hover:border-ink">
        Show
      </button>
      {filter.plantRef || filter.ownerId ? (
        <a href="/records" className="text-sm">
          Clear
        </a>
      ) : null}
    </form>
  );
}

/** The organisation's tuning records, newest first. */
export function RecordList({ data, filter }: { data: RecordListData; filter: RecordListFilter }) {
  const filtered = Boolean(filter.plantRef || filter.ownerId);
  if (data.items.length === 0 && !filtered) {
    return (
      <div className="max-w-2xl space-y-2 rounded-sm border border-rule bg-paper-raised p-4 text-sm" data-testid="records-empty">
        <p className="font-medium">No tuning records yet.</p>
        <p className="text-ink-soft">
          A record is written from the pre-commissioning flow of a plant or a twin: save the tuning you settle on as a tuning set, run its proof
          tests, then write the record there. It appears here for everyone in your organisation; only you can edit and sign it off.
        </p>
        <p className="text-ink-soft">
          Start on the <Link href="/bench">Bench</Link> with a plant, or from <Link href="/twins">Twins</Link> with a bump-test log.
        </p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <RecordFilters data={data} filter={filter} />
      {data.items.length === 0 ? (
        <p className="text-sm text-ink-soft">No record matches this filter.</p>
      ) : (
        <table className="w-full text-sm">
          <TableHead columns={["Record", "Plant", "Tuning", "Author", "Written", "Sign-off"]} />
          <tbody>
            {data.items.map((r) => (
              <tr key={r.id} className="border-b border-rule align-top">
                <td className="py-2 pr-3">
                  <Link href={`/records/${r.id}`}>{r.title}</Link>
                </td>
                <td className="py-2 pr-3">
                  {r.plantName}
                  {r.origin === "twin" ? <span className="ml-2 rounded-sm border border-rule-strong px-1 text-xs text-ink-soft">twin</span> : null}
                </td>
                <td className="num py-2 pr-3 text-xs">{r.tuning}</td>
                <td className="py-2 pr-3">{r.authorName}</td>
                <td className="num py-2 pr-3">{isoDate(r.createdAt)}</td>
                <td className="py-2">
                  {r.signedOffBy ? (
                    <span>
                      signed off <span className="num">{r.signedOffOn}</span>
                    </span>
                  ) : (
                    <span className="text-ink-faint">open</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
