import { guardRoute } from "@/app/_lib/guard";
import { roster } from "@/db/queries";

// GET /api/cohorts/:id/roster — members and open invitations, for the instructors of that cohort.
export async function GET(_request: Request, { params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  const user = await guardRoute({ cohortId, cohortRole: "instructor" });
  if (user instanceof Response) return user;
  return Response.json(await roster(cohortId), { headers: { "cache-control": "no-store" } });
}
