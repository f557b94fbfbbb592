/** The twins a user may read: own first, then the organisation's shared ones, with the model in use and where it came from. */
import Link from "next/link";
import { TableHead } from "@/components/tables/TableHead";
import type { TwinListItem } from "@/app/_lib/twins/twin-queries";
import { kindLabel, modelSummary, r2Text } from "./model-format";
import { TwinLinks } from "./TwinLinks";

const dateFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

export function TwinList({ twins }: { twins: TwinListItem[] }) {
  if (twins.length === 0) {
    return <p className="text-sm text-ink-soft" data-testid="twin-list-empty">No twins yet. Start with a new twin from a bump-test log, or try one of the example logs.</p>;
  }
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm" data-testid="twin-list">
        <TableHead columns={["Twin", "Model", "R²", "Source file", "Owner", "Shared", ""]} />
        <tbody>
          {twins.map((t) => (
            <tr key={t.id} className="border-b border-rule align-top" data-testid="twin-row">
              <td className="py-2 pr-3">
                <Link href={`/twins/${t.id}`} className="font-medium">
                  {t.name}
                </Link>
                <span className="block text-xs text-ink-faint">{dateFmt.format(new Date(t.createdAt))}</span>
              </td>
              <td className="num py-2 pr-3">
                {t.chosen ? (
                  <>
                    <span className="text-ink-soft">{kindLabel(t.chosen.kind)}</span> {modelSummary(t.chosen)}
                  </>
                ) : (
                  "—"
                )}
              </td>
              <td className="num py-2 pr-3">{t.chosen ? r2Text(t.chosen.quality.r2) : "—"}</td>
              <td className="py-2 pr-3 text-ink-soft">{t.upload.fileName}</td>
              <td className="py-2 pr-3 text-ink-soft">{t.mine ? "you" : t.ownerName}</td>
              <td className="py-2 pr-3 text-ink-soft">{t.shared ? <span className="rounded-sm border border-rule-strong px-1.5 py-0.5 text-xs">organisation</span> : "private"}</td>
              <td className="py-2">
                <TwinLinks plantId={t.id} withDetails />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
