import { guardRoute } from "@/app/_lib/guard";
import { drillVersionFor } from "@/db/drill-queries";

// GET /api/drills/:drillId/versions/:version — { version: DrillVersionDocument }: one version's
// drill document (engine format, as stored) with its status and publishedAt; `latest` for the
// newest. 404 for an unknown version or a drill the user may not view; trainees get 403.
export async function GET(_request: Request, { params }: { params: Promise<{ drillId: string; version: string }> }) {
  const { drillId, version } = await params;
  const user = await guardRoute({ roles: ["instructor", "admin"] });
  if (user instanceof Response) return user;
  const n = version === "latest" ? undefined : /^[1-9][0-9]{0,8}$/.test(version) ? Number(version) : NaN;
  const found = Number.isNaN(n) ? null : await drillVersionFor(user, drillId, n);
  if (!found) return Response.json({ error: "No such drill version." }, { status: 404 });
  return Response.json({ version: found }, { headers: { "cache-control": "no-store" } });
}
