/** Where a twin is used: the Bench (as plant:<id>) and Pre-commission. */
import Link from "next/link";

const look = "text-sm underline decoration-rule-strong hover:text-ink";

export function TwinLinks({ plantId, withDetails = false }: { plantId: string; withDetails?: boolean }) {
  return (
    <span className="flex flex-wrap gap-x-3 gap-y-1 text-ink-soft">
      {withDetails ? (
        <Link href={`/twins/${plantId}`} className={look}>
          details
        </Link>
      ) : null}
      <Link href={`/bench?plant=${encodeURIComponent(`plant:${plantId}`)}`} className={look}>
        Open on the Bench
      </Link>
      <Link href={`/commissioning/${plantId}`} className={look}>
        Pre-commission
      </Link>
    </span>
  );
}
