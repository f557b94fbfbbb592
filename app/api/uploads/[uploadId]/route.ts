import { guardRoute } from "@/app/_lib/guard";
import { attachmentDisposition, logMediaType } from "@/app/_lib/http/content-disposition";
import { uploadContent } from "@/app/_lib/twins/twin-queries";

// GET /api/uploads/:uploadId — the original bump-test log exactly as uploaded (an attachment under
// its own name, with its SHA-256 in x-content-sha256 so a download can be checked). Readable by the
// upload's owner and by whoever may read a twin made from it; 404 otherwise (never "forbidden":
// that would confirm the upload exists).
export async function GET(_request: Request, { params }: { params: Promise<{ uploadId: string }> }) {
  const { uploadId } = await params;
  const user = await guardRoute();
  if (user instanceof Response) return user;
  const upload = await uploadContent(user, uploadId);
  if (!upload) return Response.json({ error: "No such upload." }, { status: 404 });
  return new Response(new Uint8Array(upload.content), {
    headers: {
      "content-type": logMediaType(upload.fileName),
      "content-length": String(upload.content.length),
      "content-disposition": attachmentDisposition(upload.fileName),
      "x-content-sha256": upload.sha256,
      "x-content-type-options": "nosniff",
      "cache-control": "private, no-store",
    },
  });
}
