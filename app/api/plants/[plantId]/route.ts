import { guardRoute } from "@/app/_lib/guard";
import { plantFor } from "@/db/bench-queries";

// GET /api/plants/:plantId — { plant: PlantListItem } for a stored plant (uuid) the user may read
// or a preset (its id); 404 for anything else, so private plants of others are not revealed.
export async function GET(_request: Request, { params }: { params: Promise<{ plantId: string }> }) {
  const { plantId } = await params;
  const user = await guardRoute();
  if (user instanceof Response) return user;
  const plant = await plantFor(user, plantId);
  if (!plant) return Response.json({ error: "No such plant." }, { status: 404 });
  return Response.json({ plant }, { headers: { "cache-control": "no-store" } });
}
