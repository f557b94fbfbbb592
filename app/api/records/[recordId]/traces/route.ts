import { visibleRecordOr404 } from "@/app/_lib/records/visible-record";
import { attachmentDisposition } from "@/app/_lib/http/content-disposition";
import { recordFileName } from "@/app/_lib/records/record-filename";
import { recordTracesCsv, TraceMismatch } from "@/app/_lib/records/record-traces-csv";

// GET /api/records/:recordId/traces — every proof test's full-resolution trace as one CSV,
// re-run by the engine and checked against the stored fingerprints; for signed-in users of the
// record's organisation (404 for a missing or foreign record alike; 409 if a re-run no longer matches).
export async function GET(_request: Request, { params }: { params: Promise<{ recordId: string }> }) {
  const { recordId } = await params;
  const detail = await visibleRecordOr404(recordId);
  if (detail instanceof Response) return detail;
  let csv: string;
  try {
    csv = recordTracesCsv(detail);
  } catch (err) {
    if (err instanceof TraceMismatch) return Response.json({ error: err.message }, { status: 409 });
    throw err;
  }
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": attachmentDisposition(recordFileName(detail.title, "-traces", "csv")),
      "cache-control": "private, no-store",
    },
  });
}
