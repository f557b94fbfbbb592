// Drill rules, independent of Next: drills and their versions. Server actions
// (app/(app)/drills/actions.ts) call these after the guard has established the signed-in user;
// integration tests (tests/integration/drills.test.ts) call them directly against a real database.
//
// Rules:
// - only instructors and admins build drills; trainees are refused here as well as by the guard;
// - a drill belongs to its owner and the owner's organisation; only the owner changes it
//   (drafts, publishing, sharing, archiving);
// - instructors of the same organisation may view and duplicate a drill its owner shared (while
//   it is not archived); admins view and duplicate every drill of their organisation; nobody sees
//   across organisations;
// - a drill's content lives in numbered versions 1, 2, …: at most one draft, edited in place;
//   publishing freezes it (never updated again: this module only ever updates rows whose status
//   is 'draft', and the trigger of migration 0002 refuses any update of a published row);
//   saving while no draft is open (the drill's versions are all published) starts version N+1
//   as a draft;
// - the stored document is the engine's drill format (sim/drill/schema.ts), parsed with its zod
//   schema, with `id` = the drill's id and `revision` = the version number; bad input writes
//   nothing (each change is one transaction, validation comes first).
import { and, desc, eq } from "drizzle-orm";
import { z } from "zod";
import { getDb, type Transaction } from "@/db/client";
import { isDrillBuilder, viewableDrill } from "@/db/drill-queries";
import { drills, drillVersions, type DrillRow, type UserRole } from "@/db/schema";
import { drillSchema, type Drill } from "@/sim/drill/schema";
import { findPreset } from "@/sim/plant/presets";
import { isStarterId, starterDocument } from "@/components/drills/starters";
import { ActionRefused } from "./action";

/** Who is acting (SignedInUser satisfies this). */
export interface DrillActor {
  id: string;
  organizationId: string;
  role: UserRole;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const NOT_ALLOWED = "You are not allowed to do that.";
const NO_SUCH_DRILL = "That drill does not exist.";


function assertBuilder(user: DrillActor): void {
  if (!isDrillBuilder(user)) throw new ActionRefused(NOT_ALLOWED);
}

// ---- input ----

/** "a.b.0.c: message" for the first issue of a zod error. */
export function firstIssue(error: z.ZodError): string {
  const issue = error.issues[0];
  if (!issue) return "Check the input.";
  return issue.path.length ? `${issue.path.map(String).join(".")}: ${issue.message}` : issue.message;
}

export const drillTitleField = z.string().trim().min(1, "Give the drill a title.").max(160, "Keep the title under 160 characters.");

export const createDrillSchema = z.object({
  title: drillTitleField,
  starter: z.string().refine(isStarterId, "Choose a starting point."),
});
export type CreateDrillInput = z.input<typeof createDrillSchema>;

/** The document of a draft: the engine's format, with id and revision supplied by the drill. */
export function validateDrillDocument(document: unknown, drillId: string, version: number): { ok: true; drill: Drill } | { ok: false; error: string } {
  if (!document || typeof document !== "object" || Array.isArray(document)) return { ok: false, error: "The drill is not valid — the document must be a JSON object." };
  const r = drillSchema.safeParse({ ...(document as Record<string, unknown>), id: drillId, revision: version });
  if (!r.success) return { ok: false, error: `The drill is not valid — ${firstIssue(r.error)}` };
  if (r.data.plant.kind === "preset" && !findPreset(r.data.plant.presetId)) return { ok: false, error: `The drill is not valid — plant.presetId: no plant preset "${r.data.plant.presetId}"` };
  return { ok: true, drill: r.data };
}

function validatedDocument(document: unknown, drillId: string, version: number): Drill {
  const r = validateDrillDocument(document, drillId, version);
  if (!r.ok) throw new ActionRefused(r.error);
  return r.drill;
}

const asJson = (d: Drill) => d as unknown as Record<string, unknown>;

// ---- locking helpers ----

async function viewableForUpdate(tx: Transaction, user: DrillActor, drillId: string): Promise<DrillRow> {
  assertBuilder(user);
  if (!uuidPattern.test(drillId)) throw new ActionRefused(NO_SUCH_DRILL);
  const [row] = await tx.select().from(drills).where(and(eq(drills.id, drillId), viewableDrill(user))).for("update");
  if (!row) throw new ActionRefused(NO_SUCH_DRILL);
  return row;
}

async function ownForUpdate(tx: Transaction, user: DrillActor, drillId: string, opts: { allowArchived?: boolean } = {}): Promise<DrillRow> {
  const row = await viewableForUpdate(tx, user, drillId);
  if (row.ownerId !== user.id) throw new ActionRefused("Only the owner of this drill can change it. Duplicate it to make your own.");
  if (row.archivedAt && !opts.allowArchived) throw new ActionRefused("This drill is archived. Restore it before changing it.");
  return row;
}

async function latestVersion(tx: Transaction, drillId: string) {
  const [v] = await tx.select().from(drillVersions).where(eq(drillVersions.drillId, drillId)).orderBy(desc(drillVersions.version)).limit(1);
  return v ?? null;
}

async function openDraft(tx: Transaction, drillId: string) {
  const [v] = await tx.select().from(drillVersions).where(and(eq(drillVersions.drillId, drillId), eq(drillVersions.status, "draft")));
  return v ?? null;
}

// ---- drills ----

export async function createDrill(user: DrillActor, input: CreateDrillInput): Promise<{ id: string; version: number }> {
  assertBuilder(user);
  const p = createDrillSchema.safeParse(input);
  if (!p.success) throw new ActionRefused(firstIssue(p.error));
  return getDb().transaction(async (tx) => {
    const [drill] = await tx.insert(drills).values({ organizationId: user.organizationId, ownerId: user.id, title: p.data.title }).returning();
    const document = validatedDocument(starterDocument(p.data.starter, drill.id, p.data.title), drill.id, 1);
    await tx.insert(drillVersions).values({ drillId: drill.id, version: 1, status: "draft", document: asJson(document), createdBy: user.id });
    return { id: drill.id, version: 1 };
  });
}

/** Saves the document as the open draft, or as a new draft version N+1 when every version is published. */
export async function saveDraft(user: DrillActor, drillId: string, document: unknown): Promise<{ version: number; created: boolean }> {
  return getDb().transaction(async (tx) => {
    const drill = await ownForUpdate(tx, user, drillId);
    const draft = await openDraft(tx, drill.id);
    const version = draft ? draft.version : ((await latestVersion(tx, drill.id))?.version ?? 0) + 1;
    const parsed = validatedDocument(document, drill.id, version);
    if (draft) {
      // the update path only ever touches a draft (the trigger refuses published rows as well)
      const updated = await tx
        .update(drillVersions)
        .set({ document: asJson(parsed) })
        .where(and(eq(drillVersions.id, draft.id), eq(drillVersions.status, "draft")))
        .returning({ id: drillVersions.id });
      if (updated.length !== 1) throw new ActionRefused("That version was published meanwhile. Reload the drill.");
    } else {
      await tx.insert(drillVersions).values({ drillId: drill.id, version, status: "draft", document: asJson(parsed), createdBy: user.id });
    }
    await tx.update(drills).set({ title: parsed.title, updatedAt: new Date() }).where(eq(drills.id, drill.id));
    return { version, created: !draft };
  });
}

/** Freezes the open draft as a published version. */
export async function publishDraft(user: DrillActor, drillId: string): Promise<{ version: number }> {
  return getDb().transaction(async (tx) => {
    const drill = await ownForUpdate(tx, user, drillId);
    const draft = await openDraft(tx, drill.id);
    if (!draft) throw new ActionRefused("There is no draft to publish: every version is already published.");
    // validated again with the engine of today: a draft saved by an older engine must still parse
    const parsed = validatedDocument(draft.document, drill.id, draft.version);
    const now = new Date();
    const updated = await tx
      .update(drillVersions)
      .set({ status: "published", publishedAt: now, document: asJson(parsed) })
      .where(and(eq(drillVersions.id, draft.id), eq(drillVersions.status, "draft")))
      .returning({ id: drillVersions.id });
    if (updated.length !== 1) throw new ActionRefused("That version was published meanwhile. Reload the drill.");
    await tx.update(drills).set({ title: parsed.title, updatedAt: now }).where(eq(drills.id, drill.id));
    return { version: draft.version };
  });
}

/** Opens a new draft N+1 copying a published version (default: the latest published one). */
export async function newDraftFromPublished(user: DrillActor, drillId: string, fromVersion?: number): Promise<{ version: number }> {
  return getDb().transaction(async (tx) => {
    const drill = await ownForUpdate(tx, user, drillId);
    const draft = await openDraft(tx, drill.id);
    if (draft) throw new ActionRefused(`Version ${draft.version} is already an open draft: edit that one.`);
    const [source] = await tx
      .select()
      .from(drillVersions)
      .where(and(eq(drillVersions.drillId, drill.id), eq(drillVersions.status, "published"), fromVersion === undefined ? undefined : eq(drillVersions.version, fromVersion)))
      .orderBy(desc(drillVersions.version))
      .limit(1);
    if (!source) throw new ActionRefused(fromVersion === undefined ? "This drill has no published version." : `Version ${fromVersion} is not a published version of this drill.`);
    const version = (await latestVersion(tx, drill.id))!.version + 1;
    const parsed = validatedDocument(source.document, drill.id, version);
    await tx.insert(drillVersions).values({ drillId: drill.id, version, status: "draft", document: asJson(parsed), createdBy: user.id });
    await tx.update(drills).set({ updatedAt: new Date() }).where(eq(drills.id, drill.id));
    return { version };
  });
}

/** A new drill of the user's own whose draft v1 is the latest version (draft or published) of one they may view. */
export async function duplicateDrill(user: DrillActor, drillId: string, title?: string): Promise<{ id: string }> {
  return getDb().transaction(async (tx) => {
    const source = await viewableForUpdate(tx, user, drillId);
    const latest = await latestVersion(tx, source.id);
    if (!latest) throw new ActionRefused("That drill has no version to copy.");
    const newTitle = drillTitleField.safeParse(title ?? `${source.title} (copy)`.slice(0, 160));
    if (!newTitle.success) throw new ActionRefused(firstIssue(newTitle.error));
    const [copy] = await tx.insert(drills).values({ organizationId: user.organizationId, ownerId: user.id, title: newTitle.data }).returning();
    const parsed = validatedDocument({ ...latest.document, title: newTitle.data }, copy.id, 1);
    await tx.insert(drillVersions).values({ drillId: copy.id, version: 1, status: "draft", document: asJson(parsed), createdBy: user.id });
    return { id: copy.id };
  });
}

export async function setDrillShared(user: DrillActor, drillId: string, shared: boolean): Promise<void> {
  await getDb().transaction(async (tx) => {
    const drill = await ownForUpdate(tx, user, drillId);
    await tx.update(drills).set({ sharedWithOrg: shared, updatedAt: new Date() }).where(eq(drills.id, drill.id));
  });
}

/** Archives (hides from colleagues' lists, no further edits) or restores a drill. Versions stay. */
export async function archiveDrill(user: DrillActor, drillId: string, archived = true): Promise<void> {
  await getDb().transaction(async (tx) => {
    const drill = await ownForUpdate(tx, user, drillId, { allowArchived: true });
    await tx.update(drills).set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() }).where(eq(drills.id, drill.id));
  });
}
