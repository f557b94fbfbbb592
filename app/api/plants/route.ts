import { guardRoute } from "@/app/_lib/guard";
import { plantsFor } from "@/db/bench-queries";

// GET /api/plants — { plants: PlantListItem[] }: the engine's presets, the user's own plants and
// plants shared within the organisation, each with its definition and a derived-figures summary.
export async function GET() {
  const user = await guardRoute();
  if (user instanceof Response) return user;
  return Response.json({ plants: await plantsFor(user) }, { headers: { "cache-control": "no-store" } });
}
