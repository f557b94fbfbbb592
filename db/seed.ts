// Demo data, idempotent: a fictional technical college's mechatronics lab (invented by Loopwright;
// every name and address here is made up). Demo credentials are for local demo installations only.
import { and, eq, sql as dsql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { hashPassword } from "../app/_lib/password";
import { newUserId } from "../app/_lib/tokens";
import { cohortMemberships, cohorts, organizations, users } from "./schema";
import { seedDemoDrills } from "./seed-drills";

export const DEMO_PASSWORD = "demo-loop-2026";
export const DEMO_ORGANIZATION = "Kestrel Fen Technical College — Mechatronics Lab";
export const DEMO_COHORT = "Process Control 2 — Spring block";

export const demoPeople = {
  admin: { email: "admin@kestrelfen.example", displayName: "Ines Varga", role: "admin" as const },
  instructors: [
    { email: "m.okafor@kestrelfen.example", displayName: "Marcus Okafor", role: "instructor" as const },
    { email: "h.lindqvist@kestrelfen.example", displayName: "Hanne Lindqvist", role: "instructor" as const },
  ],
  trainees: [
    "Arjun Mehta",
    "Bea Castell",
    "Cormac Doyle",
    "Dalia Rahman",
    "Emil Sørby",
    "Fenna Brouwer",
    "Gideon Ashe",
    "Hoa Tran",
  ].map((name) => ({
    email: `${name.split(" ")[0].toLowerCase()}@students.kestrelfen.example`,
    displayName: name,
    role: "trainee" as const,
  })),
};

export async function seedDemo(url: string): Promise<void> {
  const client = postgres(url, { max: 1, onnotice: () => {} });
  const db = drizzle(client);
  try {
    await db.transaction(async (tx) => {
      let [org] = await tx.select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
      if (!org) [org] = await tx.insert(organizations).values({ name: DEMO_ORGANIZATION }).returning();

      let [cohort] = await tx
        .select()
        .from(cohorts)
        .where(and(eq(cohorts.organizationId, org.id), eq(cohorts.name, DEMO_COHORT)));
      if (!cohort) {
        [cohort] = await tx
          .insert(cohorts)
          .values({ organizationId: org.id, name: DEMO_COHORT, timeZone: "Europe/Dublin" })
          .returning();
      }

      const passwordHash = await hashPassword(DEMO_PASSWORD);
      const people = [demoPeople.admin, ...demoPeople.instructors, ...demoPeople.trainees];
      for (const person of people) {
        let [user] = await tx.select().from(users).where(eq(dsql`lower(${users.email})`, person.email));
        if (!user) {
          [user] = await tx
            .insert(users)
            .values({ id: newUserId(), organizationId: org.id, passwordHash, ...person })
            .returning();
        }
        if (person.role !== "admin") {
          await tx
            .insert(cohortMemberships)
            .values({ cohortId: cohort.id, userId: user.id, role: person.role })
            .onConflictDoNothing();
        }
      }
    });
  } finally {
    await client.end();
  }
  await seedDemoDrills(url);
}

if (process.argv[1]?.endsWith("seed.ts")) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("DATABASE_URL is not set (npm start seeds the local database itself)");
    process.exit(2);
  }
  seedDemo(url).then(
    () => console.log("demo data seeded"),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
