// Reads of tuning records. A record is a hand-over document shared within its organisation: every
// signed-in user of the organisation reads every record of it; nobody outside does. A record that
// is missing and one of another organisation get the same answer (null), so ids cannot be probed.
import { and, asc, desc, eq, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { tuningRecords, users } from "@/db/schema";
import { isUuid, parsePlantRef, type BenchUser } from "@/app/_lib/bench-store";
import { controllerConfigSchema } from "@/sim/control/config";
import { recordDocumentSchema, type RecordDocument } from "./record-document";
import { tuningSummary } from "./record-figures";
import { canonicalRef } from "@/app/_lib/plant-ref";

export interface RecordListFilter {
  /** "preset:<id>" | "plant:<uuid>"; anything else is ignored */
  plantRef?: string | null;
  /** the author's user id */
  ownerId?: string | null;
}

export interface RecordListItem {
  id: string;
  title: string;
  plantRef: string;
  plantName: string;
  origin: "physical" | "twin" | "preset";
  tuning: string;
  authorId: string;
  authorName: string;
  createdAt: Date;
  signedOffBy: string | null;
  signedOffOn: string | null;
}

export interface RecordList {
  items: RecordListItem[];
  /** for the filter selects: every plant and author among the organisation's records */
  plants: { ref: string; name: string }[];
  authors: { id: string; name: string }[];
}

const origins = new Set(["physical", "twin", "preset"]);

export async function recordsFor(user: BenchUser, filter: RecordListFilter = {}): Promise<RecordList> {
  const db = getDb();
  const inOrg = eq(tuningRecords.organizationId, user.organizationId);
  const ref = filter.plantRef ? parsePlantRef(filter.plantRef) : null;
  const conditions = [inOrg];
  if (ref) conditions.push(eq(tuningRecords.plantRef, canonicalRef(ref)));
  if (filter.ownerId) conditions.push(eq(tuningRecords.ownerId, filter.ownerId));
  const [rows, plantRows, authorRows] = await Promise.all([
    db
      .select({
        id: tuningRecords.id,
        title: tuningRecords.title,
        plantRef: tuningRecords.plantRef,
        plantName: tuningRecords.plantName,
        origin: sql<string>`${tuningRecords.document}->'plant'->>'origin'`,
        controller: sql<unknown>`${tuningRecords.document}->'controller'`,
        authorId: tuningRecords.ownerId,
        authorName: users.displayName,
        createdAt: tuningRecords.createdAt,
        signedOffBy: tuningRecords.signedOffBy,
        signedOffOn: tuningRecords.signedOffOn,
      })
      .from(tuningRecords)
      .innerJoin(users, eq(users.id, tuningRecords.ownerId))
      .where(and(...conditions))
      .orderBy(desc(tuningRecords.createdAt), desc(tuningRecords.id)),
    db
      .selectDistinctOn([tuningRecords.plantRef], { ref: tuningRecords.plantRef, name: tuningRecords.plantName })
      .from(tuningRecords)
      .where(inOrg)
      .orderBy(asc(tuningRecords.plantRef), desc(tuningRecords.createdAt)),
    db
      .selectDistinct({ id: users.id, name: users.displayName })
      .from(tuningRecords)
      .innerJoin(users, eq(users.id, tuningRecords.ownerId))
      .where(inOrg),
  ]);
  const items = rows.map(({ controller, origin, ...r }) => {
    const c = controllerConfigSchema.safeParse(controller);
    return { ...r, origin: (origins.has(origin) ? origin : "physical") as RecordListItem["origin"], tuning: c.success ? tuningSummary(c.data) : "—" };
  });
  const byName = <T extends { name: string }>(a: T, b: T) => a.name.localeCompare(b.name, "en");
  return { items, plants: plantRows.sort(byName), authors: authorRows.sort(byName) };
}

export interface RecordDetail {
  id: string;
  title: string;
  notes: string;
  plantRef: string;
  plantId: string | null;
  ownerId: string;
  authorName: string;
  /** the reader is the author: may edit and sign off while unsigned */
  isOwner: boolean;
  createdAt: Date;
  updatedAt: Date;
  signedOffBy: string | null;
  signedOffOn: string | null;
  signedOffAt: Date | null;
  engineVersion: string;
  document: RecordDocument;
}

export async function recordDetail(user: BenchUser, id: string): Promise<RecordDetail | null> {
  if (!isUuid(id)) return null;
  const [row] = await getDb()
    .select({ r: tuningRecords, authorName: users.displayName })
    .from(tuningRecords)
    .innerJoin(users, eq(users.id, tuningRecords.ownerId))
    .where(and(eq(tuningRecords.id, id), eq(tuningRecords.organizationId, user.organizationId)));
  if (!row) return null;
  const r = row.r;
  return {
    id: r.id,
    title: r.title,
    notes: r.notes,
    plantRef: r.plantRef,
    plantId: r.plantId,
    ownerId: r.ownerId,
    authorName: row.authorName,
    isOwner: r.ownerId === user.id,
    createdAt: r.createdAt,
    updatedAt: r.updatedAt,
    signedOffBy: r.signedOffBy,
    signedOffOn: r.signedOffOn,
    signedOffAt: r.signedOffAt,
    engineVersion: r.engineVersion,
    document: recordDocumentSchema.parse(r.document),
  };
}
