import { visibleRecordOr404 } from "@/app/_lib/records/visible-record";
import { attachmentDisposition } from "@/app/_lib/http/content-disposition";
import { recordFileName } from "@/app/_lib/records/record-filename";
import { recordPdf } from "@/app/_lib/records/record-pdf";

// GET /api/records/:recordId/pdf — the tuning record as a PDF, for signed-in users of the
// record's organisation (404 for a missing or foreign record alike). pdfkit stays outside the
// bundle (serverExternalPackages), so it finds its font metrics on disk.

export async function GET(_request: Request, { params }: { params: Promise<{ recordId: string }> }) {
  const { recordId } = await params;
  const detail = await visibleRecordOr404(recordId);
  if (detail instanceof Response) return detail;
  const pdf = await recordPdf(detail);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": attachmentDisposition(recordFileName(detail.title, "", "pdf")),
      "cache-control": "private, no-store",
    },
  });
}
