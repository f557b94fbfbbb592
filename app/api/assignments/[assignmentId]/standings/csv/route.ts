import { guardRoute } from "@/app/_lib/guard";
import { standings, standingsCsv } from "@/app/_lib/classroom/standings";
import { attachmentDisposition, fileNameSlug } from "@/app/_lib/http/content-disposition";

// GET /api/assignments/:assignmentId/standings/csv?view=best|all — the standings as CSV, for the
// cohort's instructors and the organisation's admins.
export async function GET(request: Request, { params }: { params: Promise<{ assignmentId: string }> }) {
  const { assignmentId } = await params;
  const user = await guardRoute({ roles: ["instructor", "admin"], assignmentId, cohortRole: "instructor" });
  if (user instanceof Response) return user;
  const view = new URL(request.url).searchParams.get("view") === "all" ? "all" : "best";
  const body = await standings(user, true, assignmentId, view);
  if (!body) return Response.json({ error: "No such assignment." }, { status: 404 });
  const name = `standings-${fileNameSlug(body.assignment.title, "assignment")}-${view}.csv`;
  return new Response(standingsCsv(body), {
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": attachmentDisposition(name), "cache-control": "no-store" },
  });
}
