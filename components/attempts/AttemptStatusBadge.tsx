/** An attempt's status as a small tag: started, verifying… (a subtle pulse), verified, failed. */
import type { AttemptStatus } from "@/app/_lib/classroom/contracts";

const STYLE: Record<AttemptStatus, string> = {
  started: "border-rule-strong text-ink-soft",
  verifying: "border-rule-strong text-ink-soft animate-pulse",
  verified: "border-ok text-ok",
  failed: "border-alarm bg-alarm-soft text-alarm",
};

const TEXT: Record<AttemptStatus, string> = { started: "started", verifying: "verifying…", verified: "verified", failed: "failed" };

export function AttemptStatusBadge({ status }: { status: AttemptStatus }) {
  return (
    <span className={`inline-block rounded-sm border px-1 text-xs ${STYLE[status]}`} data-testid="attempt-status" data-status={status}>
      {TEXT[status]}
    </span>
  );
}
