import { assignmentCohortId, cohortAccess, guardRoute } from "@/app/_lib/guard";
import { standings, standingsEtag } from "@/app/_lib/classroom/standings";

// GET /api/assignments/:assignmentId/standings?view=best|all — StandingsResponse
// (app/_lib/classroom/contracts.ts). Members of the assignment's cohort and the organisation's
// admins; trainees get what the assignment's visibility allows. Fetched with SWR on an interval;
// an ETag lets an unchanged table be answered 304 (standingsEtag).
export async function GET(request: Request, { params }: { params: Promise<{ assignmentId: string }> }) {
  const { assignmentId } = await params;
  const user = await guardRoute({ assignmentId, cohortRole: "member" });
  if (user instanceof Response) return user;
  const view = new URL(request.url).searchParams.get("view") === "all" ? "all" : "best";
  const cohortId = (await assignmentCohortId(user, assignmentId))!;
  const staff = user.role !== "trainee" && (await cohortAccess(user, cohortId, "instructor"));
  // private, revalidated every time: the browser keeps the last answer and asks with If-None-Match
  const { etag, stamp } = await standingsEtag(user, staff, assignmentId, view);
  const headers = { "cache-control": "private, no-cache", etag, vary: "cookie" };
  if (request.headers.get("if-none-match") === etag) return new Response(null, { status: 304, headers });
  const body = await standings(user, staff, assignmentId, view, stamp);
  if (!body) return Response.json({ error: "No such assignment." }, { status: 404 });
  return Response.json(body, { headers });
}
