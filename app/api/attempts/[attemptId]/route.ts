import { ActionRefused } from "@/app/_lib/action";
import { guardRoute } from "@/app/_lib/guard";
import { attemptDetail } from "@/app/_lib/classroom/attempts";

// GET /api/attempts/:attemptId — AttemptDetail (app/_lib/classroom/contracts.ts): the trainee's
// own attempt, or any attempt of a cohort the user instructs (admins: their organisation's).
// 404 for anyone else, so attempts are not revealed. Polled while the attempt is verifying.
export async function GET(_request: Request, { params }: { params: Promise<{ attemptId: string }> }) {
  const { attemptId } = await params;
  const user = await guardRoute();
  if (user instanceof Response) return user;
  try {
    return Response.json(await attemptDetail(user, attemptId), { headers: { "cache-control": "no-store" } });
  } catch (err) {
    if (err instanceof ActionRefused) return Response.json({ error: err.message }, { status: 404 });
    throw err;
  }
}
