// npm run perf:classroom — load figures for the classroom (a benchmark, not a test), on loopback
// against a running app with its worker (npm start, or E2E_BASE_URL + DATABASE_URL):
//   1. 200 attempts submitted concurrently, each also sent a second time at once with the same
//      submission key (the idempotency key): how long until all are accepted and all verified by
//      the worker, and a count of the rows and jobs (none lost, none duplicated);
//   2. the standings route handler under 50 concurrent clients on an assignment with 10 000
//      verified attempts, while another 200 submissions are being replayed: p50 and p95 latency,
//      (a) with clients polling as the page does (SWR via the browser cache: If-None-Match, once a
//      second, five times the page's rate) and (b) the worst case of full answers back to back.
// Submissions go through the same domain function the server action calls (submitAttempt: zod,
// ownership, one transaction, the queue), in this process; the replays run in the app's worker.
import { randomBytes, randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { ensureLocalDatabase } from "@/db/local-postgres";

const base = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3000";
const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];
const ms = (t0: number) => performance.now() - t0;

async function main() {
  process.env.DATABASE_URL ??= (await ensureLocalDatabase()).url;
  const { getDb } = await import("@/db/client");
  const schema = await import("@/db/schema");
  const { startAttempt, submitAttempt } = await import("@/app/_lib/classroom/attempts");
  const { createDrill, publishDraft } = await import("@/app/_lib/drills");
  const { hashPassword } = await import("@/app/_lib/password");
  const { newUserId } = await import("@/app/_lib/tokens");
  const { DEMO_ORGANIZATION } = await import("@/db/seed");
  const { drillSchema } = await import("@/sim/drill/schema");
  const { runDrill } = await import("@/sim/drill/run-drill");
  const { scoreAttempt } = await import("@/sim/drill/score");
  const { traceFingerprint } = await import("@/sim/drill/trace-hash");
  const db = getDb();

  // ---- a cohort of 500 load-test trainees and one instructor (fictional names) ----
  const tag = `load-${Date.now().toString(36)}`;
  const [org] = await db.select().from(schema.organizations).where(eq(schema.organizations.name, DEMO_ORGANIZATION));
  const [cohort] = await db.insert(schema.cohorts).values({ organizationId: org.id, name: `Load test ${tag}`, timeZone: "Europe/Dublin" }).returning();
  const hash = await hashPassword(randomBytes(12).toString("hex"));
  const mk = (role: "trainee" | "instructor", i: number) => ({ id: newUserId(), organizationId: org.id, email: `${tag}-${role}-${i}@load.test`, displayName: `Load ${role} ${i}`, passwordHash: hash, role });
  const instructor = mk("instructor", 0);
  const trainees = Array.from({ length: 500 }, (_, i) => mk("trainee", i));
  await db.insert(schema.users).values([instructor, ...trainees]);
  await db.insert(schema.cohortMemberships).values([{ cohortId: cohort.id, userId: instructor.id, role: "instructor" as const }, ...trainees.map((t) => ({ cohortId: cohort.id, userId: t.id, role: "trainee" as const }))]);
  const actor = (u: { id: string; role: "trainee" | "instructor" }) => ({ id: u.id, organizationId: org.id, role: u.role });

  const drill = await createDrill(actor(instructor), { title: `Load step ${tag}`, starter: "setpoint-step" });
  await publishDraft(actor(instructor), drill.id);
  const [version] = await db.select().from(schema.drillVersions).where(eq(schema.drillVersions.drillId, drill.id));
  const doc = drillSchema.parse(version.document);
  const assignmentRow = async (limit: number) =>
    (
      await db
        .insert(schema.assignments)
        .values({ organizationId: org.id, cohortId: cohort.id, drillVersionId: version.id, title: `Load ${tag}`, opensAt: new Date(Date.now() - 60_000), dueAt: new Date(Date.now() + 86_400_000), attemptLimit: limit, createdBy: instructor.id, openNoticeSentAt: new Date() })
        .returning()
    )[0];

  // ten honest claims (the same drill and seed, ten gains), computed once
  const claims = Array.from({ length: 10 }, (_, i) => {
    const controller = { ...doc.referenceTuning, kc: doc.referenceTuning.kc * (0.6 + 0.1 * i) };
    const run = runDrill(doc, controller, [], doc.noise.seed);
    const ref = runDrill(doc, doc.referenceTuning, [], doc.noise.seed);
    return { controller, claimed: { score: scoreAttempt(doc, run.results, ref.results).score, fingerprint: traceFingerprint(run.trace), results: run.results as unknown as Record<string, unknown> } };
  });

  async function submitWave(assignmentId: string, who: typeof trainees) {
    const started = await Promise.all(who.map((t) => startAttempt(actor(t), assignmentId)));
    const subs = started.map((a, i) => ({ user: actor(who[i]), body: { attemptId: a.attemptId, submissionKey: randomUUID(), actionLog: [], ...claims[i % claims.length] } }));
    const t0 = performance.now();
    // each submission and its duplicate (same key) at once
    const answers = await Promise.all(subs.flatMap((s) => [submitAttempt(s.user, s.body), submitAttempt(s.user, s.body)]));
    return { acceptedMs: ms(t0), t0, answers, ids: started.map((a) => a.attemptId) };
  }
  async function waitVerified(ids: string[], t0: number) {
    for (;;) {
      const [{ n }] = await db.execute<{ n: number }>(sql`select count(*)::int as n from attempts where id = any(${sql.raw(`array[${ids.map((i) => `'${i}'`).join(",")}]::uuid[]`)}) and status in ('verified','failed')`);
      if (n === ids.length) return ms(t0);
      await new Promise((r) => setTimeout(r, 100));
    }
  }

  // ---- 1. 200 concurrent submissions + 200 duplicates ----
  const a1 = await assignmentRow(3);
  const wave = await submitWave(a1.id, trainees.slice(0, 200));
  const firstAnswers = wave.answers.filter((a) => !a.repeated).length;
  const verifiedMs = await waitVerified(wave.ids, wave.t0);
  const [{ rows, submitted, verified, flagged }] = await db.execute<{ rows: number; submitted: number; verified: number; flagged: number }>(
    sql`select count(*)::int as rows, count(submitted_at)::int as submitted, count(*) filter (where status = 'verified')::int as verified, count(*) filter (where flagged)::int as flagged from attempts where assignment_id = ${a1.id}`,
  );
  const [{ jobs }] = await db.execute<{ jobs: number }>(
    sql`select count(*)::int as jobs from (select singleton_key from pgboss.job where singleton_key = any(${sql.raw(`array[${wave.ids.map((i) => `'${i}'`).join(",")}]`)}) union all select singleton_key from pgboss.archive where singleton_key = any(${sql.raw(`array[${wave.ids.map((i) => `'${i}'`).join(",")}]`)})) j`,
  );
  console.log("\n1. 200 concurrent submissions, each duplicated at once with the same key");
  console.log(`   answers: ${wave.answers.length} (${firstAnswers} first submissions, ${wave.answers.length - firstAnswers} recognised repeats)`);
  console.log(`   rows: ${rows} attempts, ${submitted} submitted, ${verified} verified, ${flagged} flagged; queue jobs: ${jobs}`);
  console.log(`   all accepted in ${(wave.acceptedMs / 1000).toFixed(2)} s; all verified ${(verifiedMs / 1000).toFixed(2)} s after the first send → ${(200 / (verifiedMs / 1000)).toFixed(1)} verified attempts/s`);

  // ---- 2. standings with 10 000 verified attempts, 50 clients, replays running ----
  const a2 = await assignmentRow(20);
  const values = [];
  for (let i = 0; i < 10_000; i++) {
    const t = trainees[i % 500];
    const score = 20 + ((i * 7919) % 6000) / 100;
    values.push({ assignmentId: a2.id, traineeId: t.id, drillVersionId: version.id, number: Math.floor(i / 500) + 1, seed: 1, status: "verified" as const, submittedAt: new Date(Date.now() - i * 1000), verifiedAt: new Date(), submissionKey: randomUUID(), engineVersion: "1.0.0", officialFingerprint: "0".repeat(16), score, rawScore: score, settlingTimeS: 300 + (i % 400), overshootC: (i % 50) / 10, iae: 1000 + i, recoveryTimeS: null, energyKWh: 0.4, safetyTrips: 0 });
  }
  for (let i = 0; i < values.length; i += 1000) await db.insert(schema.attempts).values(values.slice(i, i + 1000));
  await db.execute(sql`analyze attempts`);
  const sessionId = randomBytes(20).toString("hex");
  await db.insert(schema.sessions).values({ id: sessionId, userId: instructor.id, expiresAt: new Date(Date.now() + 3_600_000) });
  const url = `${base}/api/assignments/${a2.id}/standings`;
  /** One request; with `etag`, as a browser revalidates its cached copy (If-None-Match). */
  const get = async (etag?: string): Promise<{ ms: number; etag: string | null; status: number }> => {
    const t0 = performance.now();
    const r = await fetch(url, { headers: { cookie: `loopwright_session=${sessionId}`, ...(etag ? { "if-none-match": etag } : {}) } });
    if (r.status === 304) return { ms: ms(t0), etag: r.headers.get("etag"), status: 304 };
    if (!r.ok) throw new Error(`standings answered ${r.status}`);
    const body = (await r.json()) as { rows: unknown[] };
    if (body.rows.length !== 500) throw new Error(`expected 500 ranked trainees, got ${body.rows.length}`);
    return { ms: ms(t0), etag: r.headers.get("etag"), status: 200 };
  };
  for (let i = 0; i < 20; i++) await get(); // warm the route

  const a3 = await assignmentRow(3);
  const background = submitWave(a3.id, trainees.slice(200, 400)); // replays running meanwhile
  const clients = 50;
  // (a) like the standings page: each client polls with SWR through the browser's HTTP cache, once a
  //     second (the page refreshes every 5 s), revalidating its copy; 20 polls each
  const polled: number[] = [];
  let full = 0;
  const tp = performance.now();
  await Promise.all(
    Array.from({ length: clients }, async (_, c) => {
      await new Promise((r) => setTimeout(r, (c * 1000) / clients)); // clients arrive spread over a second
      let etag: string | undefined;
      for (let i = 0; i < 20; i++) {
        const t = performance.now();
        const r = await get(etag);
        polled.push(r.ms);
        if (r.status === 200) full++;
        etag = r.etag ?? undefined;
        await new Promise((res) => setTimeout(res, Math.max(0, 1000 - (performance.now() - t))));
      }
    }),
  );
  const wallPolled = ms(tp);
  // (b) worst case: every client fetches the whole table back to back, no cache, 20 requests each
  const latencies: number[] = [];
  const t0 = performance.now();
  await Promise.all(
    Array.from({ length: clients }, async () => {
      for (let i = 0; i < 20; i++) latencies.push((await get()).ms);
    }),
  );
  const wall = ms(t0);
  const bg = await background;
  const [{ during }] = await db.execute<{ during: number }>(sql`select count(*) filter (where status = 'verified')::int as during from attempts where assignment_id = ${a3.id}`);
  console.log("\n2. GET standings (best per trainee: 500 rows of 10 000 verified attempts), 50 concurrent clients, replays running");
  console.log(`   (a) polling once a second with If-None-Match, as the page does through the browser cache (${polled.length} requests, ${full} full answers, the rest 304):`);
  console.log(`       p50 ${pct(polled, 50).toFixed(1)} ms · p95 ${pct(polled, 95).toFixed(1)} ms · max ${Math.max(...polled).toFixed(1)} ms · ${(polled.length / (wallPolled / 1000)).toFixed(0)} requests/s`);
  console.log(`   (b) worst case, every request a full 500-row answer, back to back (${latencies.length} requests):`);
  console.log(`       p50 ${pct(latencies, 50).toFixed(1)} ms · p95 ${pct(latencies, 95).toFixed(1)} ms · max ${Math.max(...latencies).toFixed(1)} ms · ${(latencies.length / (wall / 1000)).toFixed(0)} requests/s`);
  console.log(`   meanwhile: 200 more submissions (${bg.answers.length} calls) accepted in ${(bg.acceptedMs / 1000).toFixed(2)} s; ${during} of them verified by the end of the run`);
  await waitVerified(bg.ids, bg.t0);
  process.exit(0);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.stack : err);
  process.exit(1);
});
