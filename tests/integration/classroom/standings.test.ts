// Standings, review feedback and the classroom's e-mail against the real database, worker and SMTP
// catcher: best attempt per trainee (or all), ranks, a removed trainee hidden but kept, what
// trainees see under each visibility, the CSV export, the "assignment open" notice and written
// feedback e-mailed to the trainee. The rules are the (issue 6, "Standings", "Review");
// standard competition ranking ("1224") for ties is common practice; CSV quoting follows RFC 4180.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { attemptDetail, leaveFeedback, startAttempt, submitAttempt } from "@/app/_lib/classroom/attempts";
import { setStandingsVisibility } from "@/app/_lib/classroom/assignments";
import { initialsOf, standings, standingsCsv } from "@/app/_lib/classroom/standings";
import { getDb } from "@/db/client";
import { attempts, cohortMemberships } from "@/db/schema";
import { waitForMail } from "../helpers";
import { assign, classroom, honestSubmission, waitForVerification, type Person } from "./world";

type World = Awaited<ReturnType<typeof classroom>>;
let w: World;
let assignmentId: string;
const scores = new Map<string, number[]>();

async function attemptWith(t: Person, kcFactor: number) {
  const a = await startAttempt(t, assignmentId);
  await submitAttempt(t, honestSubmission(w.drill, a.attemptId, a.seed, { ...w.drill.referenceTuning, kc: w.drill.referenceTuning.kc * kcFactor }));
  const row = await waitForVerification(a.attemptId);
  scores.set(t.id, [...(scores.get(t.id) ?? []), row.score!]);
  return row;
}

beforeAll(async () => {
  w = await classroom(["Ines Arbuthnot", "Oskar Brennan", "Yara Coyle", "Tomasz Dunne"]);
  ({ id: assignmentId } = await assign(w.instructor, w.cohort.id, w.drillId, { limit: 3, visibility: "initials" }));
  const [ines, oskar, yara, tomasz] = w.trainees;
  await attemptWith(ines, 1);
  await attemptWith(ines, 3);
  await attemptWith(oskar, 0.5);
  await attemptWith(yara, 1.5);
  await attemptWith(tomasz, 1.2);
  // Tomasz leaves the cohort: his attempt stays on record but not in the standings
  await getDb().update(cohortMemberships).set({ removedAt: new Date() }).where(and(eq(cohortMemberships.cohortId, w.cohort.id), eq(cohortMemberships.userId, tomasz.id)));
}, 180_000);

describe("standings", () => {
  it("ranks the best attempt per trainee by score, and lists every attempt on demand", async () => {
    const best = (await standings(w.instructor, true, assignmentId, "best"))!;
    const current = w.trainees.slice(0, 3);
    expect(best.rows).toHaveLength(3);
    const expected = current.map((t) => ({ name: t.name, score: Math.max(...scores.get(t.id)!) })).sort((a, b) => b.score - a.score);
    expect(best.rows.map((r) => r.traineeLabel)).toEqual(expected.map((e) => e.name));
    expect(best.rows.map((r) => r.summary.score)).toEqual(expected.map((e) => e.score));
    expect(best.rows[0].rank).toBe(1);
    expect(best.rows.find((r) => r.traineeLabel === "Ines Arbuthnot")!.attemptsUsed).toBe(2);
    const all = (await standings(w.instructor, true, assignmentId, "all"))!;
    expect(all.rows).toHaveLength(4);
    expect(all.rankedTrainees).toBe(3);
  });

  it("hides a removed trainee but keeps their attempt for the record", async () => {
    const tomasz = w.trainees[3];
    const all = (await standings(w.instructor, true, assignmentId, "all"))!;
    expect(all.rows.some((r) => r.traineeLabel === tomasz.name)).toBe(false);
    const kept = await getDb().select().from(attempts).where(and(eq(attempts.assignmentId, assignmentId), eq(attempts.traineeId, tomasz.id)));
    expect(kept).toHaveLength(1);
    expect(kept[0].status).toBe("verified");
    // and he can still open his own attempt
    expect((await attemptDetail(tomasz, kept[0].id)).official?.summary.score).toBe(kept[0].score);
  });

  it("shows trainees initials, full names or only their own rank, as the instructor chooses", async () => {
    const ines = w.trainees[0];
    const initials = (await standings(ines, false, assignmentId, "best"))!;
    expect(initials.rows.map((r) => r.traineeLabel).sort()).toEqual(["Ines Arbuthnot", initialsOf("Oskar Brennan"), initialsOf("Yara Coyle")].sort());
    expect(initials.rows.filter((r) => r.attemptId !== null).every((r) => r.isViewer)).toBe(true);
    expect(initials.rows.every((r) => r.flagged === false)).toBe(true);
    await setStandingsVisibility(w.instructor, assignmentId, "own-rank");
    const own = (await standings(ines, false, assignmentId, "best"))!;
    expect(own.rows).toHaveLength(1);
    expect(own.rows[0].isViewer).toBe(true);
    expect(own.rankedTrainees).toBe(3);
    await setStandingsVisibility(w.instructor, assignmentId, "names");
    const names = (await standings(ines, false, assignmentId, "best"))!;
    expect(names.rows.map((r) => r.traineeLabel)).toContain("Oskar Brennan");
  });

  it("exports CSV with a header and one row per standings row (RFC 4180 quoting; formula-looking text neutralised)", async () => {
    const s = (await standings(w.instructor, true, assignmentId, "all"))!;
    const csv = standingsCsv(s);
    const lines = csv.trimEnd().split("\r\n");
    expect(lines[0]).toMatch(/^rank,trainee,attempt,attempts_used,submitted_utc,late,flagged,score/);
    expect(lines).toHaveLength(s.rows.length + 1);
    const tricky = standingsCsv({ ...s, rows: [{ ...s.rows[0], traineeLabel: '=HYPERLINK("x"), "Al"' }] });
    expect(tricky.split("\r\n")[1]).toContain(`"'=HYPERLINK(""x""), ""Al"""`);
  });

  it("counts attempts being verified separately from the ranked rows", async () => {
    const s = (await standings(w.instructor, true, assignmentId, "best"))!;
    expect(s.verifying).toBe(0);
  });
});

describe("e-mail", () => {
  it("tells the cohort's trainees when an assignment opens (sent by the worker's queued job)", async () => {
    await assign(w.instructor, w.cohort.id, w.drillId, { limit: 1 });
    const mail = await waitForMail(w.trainees[1].email, "New drill assigned", 30_000);
    expect(mail.textBody).toContain("/assignments/");
    expect(mail.textBody).toMatch(/Due .*\d{4}/);
  }, 60_000);

  it("e-mails written feedback to the trainee and shows it on the attempt", async () => {
    const [row] = await getDb().select().from(attempts).where(and(eq(attempts.assignmentId, assignmentId), eq(attempts.traineeId, w.trainees[2].id)));
    await leaveFeedback(w.instructor, row.id, "Good recovery; try a little derivative action to trim the overshoot.");
    const mail = await waitForMail(w.trainees[2].email, "Feedback on your attempt", 30_000);
    expect(mail.textBody).toContain("a little derivative action");
    const seen = await attemptDetail(w.trainees[2], row.id);
    expect(seen.feedback.map((f) => f.body)).toContain("Good recovery; try a little derivative action to trim the overshoot.");
    await expect(leaveFeedback(w.trainees[0], row.id, "not mine to say")).rejects.toThrow(/does not exist/);
  }, 60_000);
});
