// Reads of drills and their versions. Callers authorize first (app/_lib/guard.ts) and pass the
// signed-in user; every query here is scoped to what that user may view (the rules of
// app/_lib/drills.ts), so a route handler cannot leak another user's private drill by forgetting
// a check. Trainees view no drill here (their assigned versions are read through assignments).
import { and, asc, desc, eq, inArray, isNull, or, sql, type SQL } from "drizzle-orm";
import type { Drill } from "@/sim/drill/schema";
import { getDb } from "./client";
import { drills, drillVersions, users, type UserRole } from "./schema";

export interface DrillReader {
  id: string;
  organizationId: string;
  role: UserRole;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isDrillBuilder(user: Pick<DrillReader, "role">): boolean {
  return user.role === "instructor" || user.role === "admin";
}

/** Drills the user may view: own; in the organisation, shared and not archived (instructors) or all (admins). */
export function viewableDrill(user: DrillReader): SQL {
  if (!isDrillBuilder(user)) return sql`false`;
  if (user.role === "admin") return eq(drills.organizationId, user.organizationId);
  return or(eq(drills.ownerId, user.id), and(eq(drills.organizationId, user.organizationId), eq(drills.sharedWithOrg, true), isNull(drills.archivedAt)))!;
}

export type DrillVersionStatus = "draft" | "published";

export interface DrillListItem {
  id: string;
  title: string;
  ownerName: string;
  /** the user owns it (and may edit it) */
  mine: boolean;
  sharedWithOrg: boolean;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
  /** status of the latest version */
  status: DrillVersionStatus;
  latestVersion: number;
  /** the open draft's version number, if any */
  draftVersion: number | null;
  /** published version numbers, ascending */
  publishedVersions: number[];
  lastPublishedAt: string | null;
}

export interface DrillVersionSummary {
  version: number;
  status: DrillVersionStatus;
  publishedAt: string | null;
  createdAt: string;
  createdByName: string;
}

export interface DrillDetail extends DrillListItem {
  versions: DrillVersionSummary[];
}

export interface DrillVersionDocument {
  drillId: string;
  version: number;
  status: DrillVersionStatus;
  publishedAt: string | null;
  /** the drill document exactly as stored (validated on write) */
  document: Drill;
}

type Row = { drill: typeof drills.$inferSelect; ownerName: string };

async function versionsOf(drillIds: string[]) {
  if (drillIds.length === 0) return [];
  return getDb()
    .select({
      drillId: drillVersions.drillId,
      version: drillVersions.version,
      status: drillVersions.status,
      publishedAt: drillVersions.publishedAt,
      createdAt: drillVersions.createdAt,
      createdByName: users.displayName,
    })
    .from(drillVersions)
    .innerJoin(users, eq(users.id, drillVersions.createdBy))
    .where(inArray(drillVersions.drillId, drillIds))
    .orderBy(asc(drillVersions.drillId), desc(drillVersions.version));
}

type VersionRow = Awaited<ReturnType<typeof versionsOf>>[number];

function toItem(user: DrillReader, { drill, ownerName }: Row, versions: VersionRow[]): DrillListItem {
  const published = versions.filter((v) => v.status === "published");
  const latest = versions[0];
  const lastPublished = published[0]?.publishedAt ?? null;
  return {
    id: drill.id,
    title: drill.title,
    ownerName,
    mine: drill.ownerId === user.id,
    sharedWithOrg: drill.sharedWithOrg,
    archivedAt: drill.archivedAt?.toISOString() ?? null,
    createdAt: drill.createdAt.toISOString(),
    updatedAt: drill.updatedAt.toISOString(),
    status: latest?.status ?? "draft",
    latestVersion: latest?.version ?? 0,
    draftVersion: versions.find((v) => v.status === "draft")?.version ?? null,
    publishedVersions: published.map((v) => v.version).sort((a, b) => a - b),
    lastPublishedAt: lastPublished ? lastPublished.toISOString() : null,
  };
}

/** Own drills first (archived ones only on request), then the organisation's others the user may view; newest change first. */
export async function drillsFor(user: DrillReader, opts: { includeArchived?: boolean } = {}): Promise<DrillListItem[]> {
  if (!isDrillBuilder(user)) return [];
  const rows = await getDb()
    .select({ drill: drills, ownerName: users.displayName })
    .from(drills)
    .innerJoin(users, eq(users.id, drills.ownerId))
    .where(and(viewableDrill(user), opts.includeArchived ? undefined : isNull(drills.archivedAt)))
    .orderBy(desc(drills.updatedAt), asc(drills.id));
  const versions = await versionsOf(rows.map((r) => r.drill.id));
  const byDrill = new Map<string, VersionRow[]>();
  for (const v of versions) byDrill.set(v.drillId, [...(byDrill.get(v.drillId) ?? []), v]);
  const items = rows.map((r) => toItem(user, r, byDrill.get(r.drill.id) ?? []));
  return [...items.filter((d) => d.mine), ...items.filter((d) => !d.mine)];
}

/** One drill the user may view, with its versions (newest first); null otherwise. */
export async function drillFor(user: DrillReader, drillId: string): Promise<DrillDetail | null> {
  if (!isDrillBuilder(user) || !uuidPattern.test(drillId)) return null;
  const [row] = await getDb()
    .select({ drill: drills, ownerName: users.displayName })
    .from(drills)
    .innerJoin(users, eq(users.id, drills.ownerId))
    .where(and(eq(drills.id, drillId), viewableDrill(user)));
  if (!row) return null;
  const versions = await versionsOf([row.drill.id]);
  return {
    ...toItem(user, row, versions),
    versions: versions.map((v) => ({
      version: v.version,
      status: v.status,
      publishedAt: v.publishedAt?.toISOString() ?? null,
      createdAt: v.createdAt.toISOString(),
      createdByName: v.createdByName,
    })),
  };
}

/** One version's document of a drill the user may view; `version` omitted = the latest. */
export async function drillVersionFor(user: DrillReader, drillId: string, version?: number): Promise<DrillVersionDocument | null> {
  if (!isDrillBuilder(user) || !uuidPattern.test(drillId)) return null;
  if (version !== undefined && !(Number.isInteger(version) && version >= 1)) return null;
  const [row] = await getDb()
    .select({ v: drillVersions })
    .from(drillVersions)
    .innerJoin(drills, eq(drills.id, drillVersions.drillId))
    .where(and(eq(drillVersions.drillId, drillId), viewableDrill(user), version === undefined ? undefined : eq(drillVersions.version, version)))
    .orderBy(desc(drillVersions.version))
    .limit(1);
  if (!row) return null;
  return {
    drillId: row.v.drillId,
    version: row.v.version,
    status: row.v.status,
    publishedAt: row.v.publishedAt?.toISOString() ?? null,
    document: row.v.document as unknown as Drill,
  };
}
