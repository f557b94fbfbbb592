// Demo drills, idempotent: two published, shared drills of the demo instructors of the fictional
// "Kestrel Fen Technical College — Mechatronics Lab" (db/seed.ts creates them). Every name, rig
// and number here is invented by Loopwright. Run after seedDemo(url); fixed ids make a second run
// a no-op (and never touch a published version: the trigger of migration 0002 would refuse it).
import { eq, sql as dsql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { drillSchema, type DrillInput } from "../sim/drill/schema";
import { steadyStateTemperatureC } from "../sim/plant/derived-figures";
import { findPreset } from "../sim/plant/presets";
import { drills, drillVersions, users } from "./schema";
import { demoPeople } from "./demo-people";

export const DEMO_DRILL_IDS = {
  ladder: "6b1d2c40-7a1e-4c55-9e0a-3f8d2b6c1a01",
  airflow: "6b1d2c40-7a1e-4c55-9e0a-3f8d2b6c1a02",
} as const;

const round1 = (x: number) => Math.round(x * 10) / 10;

function ladderDrill(): DrillInput {
  const cabinet = findPreset("benchtop-curing-cabinet")!;
  const out = 22;
  const startC = round1(steadyStateTemperatureC(cabinet.plant, out));
  return {
    formatVersion: 1,
    id: DEMO_DRILL_IDS.ladder,
    revision: 1,
    title: "Adhesive cure ladder on cabinet C-2",
    description: `Kestrel Fen lab, bench 4: a bonding job needs a 65 → 80 °C cure ladder, then a hold at 72 °C while the parts cool for handling. Cabinet C-2 has been idling at about ${startC} °C on ${out} % OUT. Run the ladder in auto with no more than 1.5 °C of overshoot on either step.`,
    plant: { kind: "preset", presetId: cabinet.id },
    initialState: { temperatures: { kind: "steady", outPercent: out }, mode: "auto", setpointC: startC, outPercent: out },
    events: [
      { type: "setpoint", timeS: 240, setpointC: 65 },
      { type: "setpoint", timeS: 2640, setpointC: 80 },
      { type: "setpoint", timeS: 5040, setpointC: 72 },
    ],
    scoring: {
      windows: [
        { id: "to-65", label: `${startC} → 65 °C`, kind: "setpoint", startS: 240, endS: 2640, weight: 1 },
        { id: "to-80", label: "65 → 80 °C", kind: "setpoint", startS: 2640, endS: 5040, weight: 1 },
        { id: "to-72", label: "80 → 72 °C", kind: "setpoint", startS: 5040, endS: 7200, weight: 0.5 },
      ],
      metricWeights: { iae: 0.4, peak: 0.35, time: 0.25 },
      bandFloorC: 0.5,
    },
    referenceTuning: { kind: "pid", form: "standard", kc: 12, ti: 360, td: 0, sampleTimeS: 0.5, pvFilterTauS: 0, antiWindup: "back-calculation" },
    trainee: { mayChange: { tuning: true, pvFilter: true, sampleTime: false }, relayTestAllowed: true, bumpTestAllowed: false },
    pace: { speeds: [1, 10, 60, 600], pauseAllowed: true },
    noise: { seedPolicy: "fixed", seed: 4207 },
    drive: { kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0.05, minOffTimeS: 0.05 },
    durationS: 7200,
  };
}

function airflowDrill(): DrillInput {
  return {
    formatVersion: 1,
    id: DEMO_DRILL_IDS.airflow,
    revision: 1,
    title: "Lint on the exhaust inlet of drying room D-1",
    description:
      "Kestrel Fen lab, workshop annexe: drying room D-1 holds 50 °C for a batch of glued laminate. Forty minutes in, lint from the sanding bay chokes the exhaust inlet to 35 % of its airflow; it is brushed clear 25 minutes later. Near the end the roller door is left open for 3 minutes. Hold 50 °C through all three.",
    plant: { kind: "preset", presetId: "walk-in-drying-room" },
    initialState: { temperatures: { kind: "steady", outPercent: 38 }, mode: "auto", setpointC: 50 },
    events: [
      { type: "inlet-blockage", timeS: 2400, percent: 65, durationS: 1500 },
      { type: "door-open", timeS: 7800, durationS: 180 },
    ],
    scoring: {
      windows: [
        { id: "take-over", label: "take-over at 50 °C", kind: "setpoint", startS: 0, endS: 2400, weight: 0.5 },
        { id: "inlet-choked", label: "inlet airflow down to 35 %", kind: "disturbance", startS: 2400, endS: 3900, weight: 1 },
        { id: "inlet-cleared", label: "inlet brushed clear", kind: "disturbance", startS: 3900, endS: 7800, weight: 1 },
        { id: "door", label: "roller door open 3 min", kind: "disturbance", startS: 7800, endS: 10800, weight: 1 },
      ],
      bandFloorC: 0.5,
    },
    referenceTuning: { kind: "pid", form: "standard", kc: 8, ti: 900, td: 0, sampleTimeS: 1, pvFilterTauS: 0, antiWindup: "back-calculation" },
    trainee: { mayChange: { tuning: true, pvFilter: true, sampleTime: true }, relayTestAllowed: true, bumpTestAllowed: true },
    pace: { speeds: [10, 60, 600], pauseAllowed: true },
    noise: { seedPolicy: "per-attempt", seed: 1893 },
    drive: { kind: "continuous" },
    durationS: 10800,
  };
}

export async function seedDemoDrills(url: string): Promise<void> {
  const client = postgres(url, { max: 1, onnotice: () => {} });
  const db = drizzle(client);
  try {
    await db.transaction(async (tx) => {
      const owners = [demoPeople.instructors[0].email, demoPeople.instructors[1].email];
      const found = [];
      for (const email of owners) {
        const [u] = await tx.select().from(users).where(eq(dsql`lower(${users.email})`, email));
        if (!u) throw new Error(`demo instructor ${email} is missing: run seedDemo first`);
        found.push(u);
      }
      const plan = [
        { owner: found[0], doc: ladderDrill() },
        { owner: found[1], doc: airflowDrill() },
      ];
      for (const { owner, doc } of plan) {
        const drill = drillSchema.parse(doc);
        await tx
          .insert(drills)
          .values({ id: drill.id, organizationId: owner.organizationId, ownerId: owner.id, title: drill.title, sharedWithOrg: true })
          .onConflictDoNothing({ target: drills.id });
        await tx
          .insert(drillVersions)
          .values({ drillId: drill.id, version: 1, status: "published", publishedAt: new Date(), document: drill as unknown as Record<string, unknown>, createdBy: owner.id })
          .onConflictDoNothing();
      }
    });
  } finally {
    await client.end();
  }
}

if (process.argv[1]?.endsWith("seed-drills.ts")) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("DATABASE_URL is not set");
    process.exit(2);
  }
  seedDemoDrills(url).then(
    () => console.log("demo drills seeded"),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
