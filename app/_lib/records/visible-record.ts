import { guardRoute } from "@/app/_lib/guard";
import { recordDetail, type RecordDetail } from "./record-queries";

/**
 * A route's tuning record for the signed-in user: the record, or the Response to send instead
 * (the guard's answer when signed out; 404 for a missing or foreign record alike, so ids cannot
 * be probed).
 */
export async function visibleRecordOr404(recordId: string): Promise<RecordDetail | Response> {
  const user = await guardRoute();
  if (user instanceof Response) return user;
  const detail = await recordDetail(user, recordId);
  if (!detail) return Response.json({ error: "No such record." }, { status: 404 });
  return detail;
}
