// Demo data, idempotent: a fictional technical college's mechatronics lab (invented by Loopwright;
// every name and address here is made up). Demo credentials are for local demo installations only.
import { and, eq, sql as dsql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { hashPassword } from "../app/_lib/password";
import { newUserId } from "../app/_lib/tokens";
import { cohortMemberships, cohorts, organizations, users } from "./schema";
import { DEMO_COHORT, DEMO_ORGANIZATION, DEMO_PASSWORD, demoPeople } from "./demo-people";
import { seedDemoDrills } from "./seed-drills";
import { seedDemoClassroom } from "./seed-classroom";
import { seedDemoTwins } from "./seed-twins";

export { DEMO_COHORT, DEMO_ORGANIZATION, DEMO_PASSWORD, demoPeople } from "./demo-people";

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
  await seedDemoClassroom(url);
  await seedDemoTwins(url);
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
