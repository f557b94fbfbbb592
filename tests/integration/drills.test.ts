// Drill rules against the real PostgreSQL test database: builders only (trainees refused), owner-only
// changes, sharing within the organisation and never outside it, published versions frozen (by the
// domain code and by the trigger of migration 0002), editing a published drill as version N+1,
// invalid documents refused by the engine's schema naming the field with nothing written, and
// duplicates that copy the latest version. The behaviours are ours (issue 6, "Drill builder");
// least privilege and "a refusal writes nothing" are common practice (OWASP Authorization Cheat
// Sheet, from memory); immutable published revisions are common practice for versioned content.
import { and, count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { ActionRefused } from "@/app/_lib/action";
import { archiveDrill, createDrill, duplicateDrill, newDraftFromPublished, publishDraft, saveDraft, setDrillShared, type DrillActor } from "@/app/_lib/drills";
import { hashPassword } from "@/app/_lib/password";
import { drillFor, drillsFor, drillVersionFor } from "@/db/drill-queries";
import { getDb } from "@/db/client";
import { drills, drillVersions, organizations } from "@/db/schema";
import { DEMO_ORGANIZATION } from "@/db/seed";
import { drillSchema } from "@/sim/drill/schema";
import { dbRefusal, makeUser } from "./helpers";

const db = () => getDb();
let passwordHash = "";


let owner: DrillActor; // instructor, Kestrel Fen
let colleague: DrillActor; // instructor, Kestrel Fen
let admin: DrillActor; // admin, Kestrel Fen
let trainee: DrillActor; // trainee, Kestrel Fen
let outsider: DrillActor; // instructor of another organisation

beforeAll(async () => {
  passwordHash = await hashPassword("not-used-for-sign-in");
  const [demo] = await db().select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
  const [other] = await db().insert(organizations).values({ name: `Saltmarsh Packaging Works ${Date.now()}` }).returning();
  owner = await makeUser(demo.id, "Owner", passwordHash, "instructor");
  colleague = await makeUser(demo.id, "Colleague", passwordHash, "instructor");
  admin = await makeUser(demo.id, "Admin", passwordHash, "admin");
  trainee = await makeUser(demo.id, "Trainee", passwordHash, "trainee");
  outsider = await makeUser(other.id, "Outsider", passwordHash, "instructor");
});

const versionsOf = (drillId: string) => db().select().from(drillVersions).where(eq(drillVersions.drillId, drillId)).orderBy(drillVersions.version);
const drillCount = async () => (await db().select({ n: count() }).from(drills))[0].n;
const versionCount = async () => (await db().select({ n: count() }).from(drillVersions))[0].n;
/** The database's own message (drizzle wraps it as the cause of "Failed query"). */
const docOf = async (drillId: string, version: number) => (await drillVersionFor(owner, drillId, version))!.document;

describe("who builds drills", () => {
  it("refuses a trainee everything and writes nothing", async () => {
    const [drillsBefore, versionsBefore] = [await drillCount(), await versionCount()];
    await expect(createDrill(trainee, { title: "Not mine to build", starter: "blank" })).rejects.toThrow(ActionRefused);
    const { id } = await createDrill(owner, { title: "Cabinet warm-up", starter: "blank" });
    await setDrillShared(owner, id, true);
    await expect(saveDraft(trainee, id, await docOf(id, 1))).rejects.toThrow(ActionRefused);
    await expect(publishDraft(trainee, id)).rejects.toThrow(ActionRefused);
    await expect(duplicateDrill(trainee, id)).rejects.toThrow(ActionRefused);
    expect(await drillsFor(trainee)).toEqual([]);
    expect(await drillFor(trainee, id)).toBeNull();
    expect(await drillVersionFor(trainee, id, 1)).toBeNull();
    expect(await drillCount()).toBe(drillsBefore + 1);
    expect(await versionCount()).toBe(versionsBefore + 1);
  });

  it("creates a drill from a starter as draft version 1, valid for the engine, id and revision set", async () => {
    const { id, version } = await createDrill(owner, { title: "Airflow on D-1", starter: "airflow-disturbance" });
    expect(version).toBe(1);
    const [v] = await versionsOf(id);
    expect(v.status).toBe("draft");
    expect(v.publishedAt).toBeNull();
    const doc = drillSchema.parse(v.document);
    expect(doc.id).toBe(id);
    expect(doc.revision).toBe(1);
    expect(doc.title).toBe("Airflow on D-1");
    expect(doc.events.some((e) => e.type === "inlet-blockage")).toBe(true);
    await expect(createDrill(owner, { title: "  ", starter: "blank" })).rejects.toThrow("Give the drill a title.");
    await expect(createDrill(owner, { title: "x", starter: "no-such-starter" })).rejects.toThrow("Choose a starting point.");
  });
});

describe("versions", () => {
  it("a published version is frozen: the trigger refuses an update and nothing changes", async () => {
    const { id } = await createDrill(owner, { title: "Ladder A", starter: "setpoint-step" });
    await expect(publishDraft(owner, id)).resolves.toEqual({ version: 1 });
    const [before] = await versionsOf(id);
    expect(before.status).toBe("published");
    expect(before.publishedAt).toBeInstanceOf(Date);
    const frozen = /is published and cannot be changed/;
    expect(await dbRefusal(db().update(drillVersions).set({ document: { ...before.document, title: "tampered" } }).where(eq(drillVersions.id, before.id)))).toMatch(frozen);
    expect(await dbRefusal(db().update(drillVersions).set({ status: "draft", publishedAt: null }).where(eq(drillVersions.id, before.id)))).toMatch(frozen);
    expect(await dbRefusal(db().delete(drillVersions).where(eq(drillVersions.id, before.id)))).toMatch(frozen);
    const [after] = await versionsOf(id);
    expect(after).toEqual(before);
    await expect(publishDraft(owner, id)).rejects.toThrow(/no draft to publish/);
  });

  it("editing a published drill makes version N+1 as a draft and leaves N as it was", async () => {
    const { id } = await createDrill(owner, { title: "Ladder B", starter: "setpoint-step" });
    await publishDraft(owner, id);
    const v1 = await docOf(id, 1);
    const edited = { ...v1, title: "Ladder B, gentler", events: [{ type: "setpoint", timeS: 300, setpointC: v1.initialState.setpointC + 8 }] };
    await expect(saveDraft(owner, id, edited)).resolves.toEqual({ version: 2, created: true });
    const rows = await versionsOf(id);
    expect(rows.map((r) => [r.version, r.status])).toEqual([
      [1, "published"],
      [2, "draft"],
    ]);
    expect(rows[0].document).toEqual(v1);
    const v2 = drillSchema.parse(rows[1].document);
    expect(v2.revision).toBe(2);
    expect(v2.title).toBe("Ladder B, gentler");
    // saving again edits the same draft in place
    await expect(saveDraft(owner, id, { ...edited, description: "second save" })).resolves.toEqual({ version: 2, created: false });
    expect((await versionsOf(id)).length).toBe(2);
    await expect(publishDraft(owner, id)).resolves.toEqual({ version: 2 });
    // "New version" from the latest published copies it as draft 3
    await expect(newDraftFromPublished(owner, id)).resolves.toEqual({ version: 3 });
    await expect(newDraftFromPublished(owner, id)).rejects.toThrow(/already an open draft/);
    const list = (await drillsFor(owner)).find((d) => d.id === id)!;
    expect(list).toMatchObject({ status: "draft", latestVersion: 3, draftVersion: 3, publishedVersions: [1, 2], title: "Ladder B, gentler" });
    // at most one draft per drill, also in the database
    expect(await dbRefusal(db().insert(drillVersions).values({ drillId: id, version: 4, status: "draft", document: rows[1].document, createdBy: owner.id }))).toMatch(/drill_versions_one_draft/);
  });

  it("refuses an invalid document naming the field, with nothing written", async () => {
    const { id } = await createDrill(owner, { title: "Door drill", starter: "blank" });
    const good = await docOf(id, 1);
    const bad = { ...good, events: [{ type: "door-open", timeS: 600, durationS: -30 }] };
    await expect(saveDraft(owner, id, bad)).rejects.toThrow(/events\.0\.durationS/);
    expect((await versionsOf(id)).map((r) => r.document)).toEqual([good]);
    await expect(saveDraft(owner, id, { ...good, scoring: { windows: [{ id: "w", kind: "setpoint", startS: 0, endS: good.durationS + 60 }] } })).rejects.toThrow(
      /scoring\.windows\.0\.endS/,
    );
    await expect(saveDraft(owner, id, { ...good, plant: { kind: "preset", presetId: "no-such-rig" } })).rejects.toThrow(/plant\.presetId/);
    await expect(saveDraft(owner, id, "not a document")).rejects.toThrow(ActionRefused);
    // with every version published, an invalid edit creates no version N+1
    await publishDraft(owner, id);
    await expect(saveDraft(owner, id, bad)).rejects.toThrow(/events\.0\.durationS/);
    expect((await versionsOf(id)).map((r) => [r.version, r.status])).toEqual([[1, "published"]]);
  });
});

describe("sharing and duplicates", () => {
  it("a shared drill is visible to instructors of the organisation only; admins see all of theirs; only the owner edits", async () => {
    const { id } = await createDrill(owner, { title: "Private for now", starter: "blank" });
    expect(await drillFor(colleague, id)).toBeNull();
    expect((await drillsFor(colleague)).some((d) => d.id === id)).toBe(false);
    await expect(duplicateDrill(colleague, id)).rejects.toThrow("That drill does not exist.");
    expect((await drillFor(admin, id))?.mine).toBe(false);
    await expect(setDrillShared(colleague, id, true)).rejects.toThrow(ActionRefused);

    await setDrillShared(owner, id, true);
    expect((await drillFor(colleague, id))?.sharedWithOrg).toBe(true);
    expect((await drillsFor(colleague)).some((d) => d.id === id && !d.mine)).toBe(true);
    expect(await drillVersionFor(colleague, id, 1)).not.toBeNull();
    expect(await drillFor(outsider, id)).toBeNull();
    expect((await drillsFor(outsider)).some((d) => d.id === id)).toBe(false);
    expect(await drillVersionFor(outsider, id)).toBeNull();
    await expect(duplicateDrill(outsider, id)).rejects.toThrow("That drill does not exist.");

    const before = await versionsOf(id);
    await expect(saveDraft(colleague, id, { ...before[0].document, title: "hijacked" })).rejects.toThrow(/Only the owner/);
    await expect(publishDraft(colleague, id)).rejects.toThrow(/Only the owner/);
    await expect(publishDraft(admin, id)).rejects.toThrow(/Only the owner/);
    await expect(archiveDrill(colleague, id)).rejects.toThrow(/Only the owner/);
    expect(await versionsOf(id)).toEqual(before);

    // archived: hidden from colleagues, kept for the owner and admins; no edits until restored
    await archiveDrill(owner, id);
    expect(await drillFor(colleague, id)).toBeNull();
    expect((await drillsFor(owner)).some((d) => d.id === id)).toBe(false);
    expect((await drillsFor(owner, { includeArchived: true })).some((d) => d.id === id)).toBe(true);
    await expect(saveDraft(owner, id, before[0].document)).rejects.toThrow(/archived/);
    await archiveDrill(owner, id, false);
    expect(await drillFor(colleague, id)).not.toBeNull();
  });

  it("duplicate copies the latest version as the new drill's draft v1, owned by the duplicating instructor", async () => {
    const { id } = await createDrill(owner, { title: "Ladder C", starter: "setpoint-step" });
    await publishDraft(owner, id);
    const v1 = await docOf(id, 1);
    await saveDraft(owner, id, { ...v1, description: "latest, still a draft", durationS: 4200 });
    await setDrillShared(owner, id, true);

    const { id: copyId } = await duplicateDrill(colleague, id);
    const copy = (await drillFor(colleague, copyId))!;
    expect(copy).toMatchObject({ mine: true, sharedWithOrg: false, status: "draft", latestVersion: 1, draftVersion: 1, publishedVersions: [], title: "Ladder C (copy)" });
    const [row] = await versionsOf(copyId);
    const copied = drillSchema.parse(row.document);
    const source = (await versionsOf(id))[1].document as Record<string, unknown>;
    expect(copied).toEqual({ ...source, id: copyId, revision: 1, title: "Ladder C (copy)" });
    expect(copied.durationS).toBe(4200);
    // the source is untouched, and the copy's owner may edit it
    expect((await versionsOf(id)).map((r) => [r.version, r.status])).toEqual([
      [1, "published"],
      [2, "draft"],
    ]);
    await expect(saveDraft(colleague, copyId, { ...copied, description: "my variant" })).resolves.toEqual({ version: 1, created: false });
    const [mine] = await db().select().from(drills).where(and(eq(drills.id, copyId), eq(drills.ownerId, colleague.id)));
    expect(mine.organizationId).toBe(colleague.organizationId);
  });
});
