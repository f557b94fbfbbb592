// npm run db:start | db:stop — the local PostgreSQL cluster by hand.
import { applyMigrations } from "./migrate";
import { ensureLocalDatabase, resolveCluster, stopCluster } from "./local-postgres";
import { seedDemo } from "./seed";

async function main(command: string | undefined) {
  switch (command) {
    case "start": {
      const { url } = await ensureLocalDatabase();
      await applyMigrations(url);
      await seedDemo(url);
      console.log(`[postgres] ready: ${url}`);
      return;
    }
    case "stop": {
      if (process.env.DATABASE_URL) {
        console.log("[postgres] DATABASE_URL is set: that server is not ours to stop");
        return;
      }
      const stopped = stopCluster(resolveCluster());
      console.log(stopped ? "[postgres] stopped" : "[postgres] was not running");
      return;
    }
    default:
      console.error("usage: tsx db/lifecycle.ts start|stop");
      process.exitCode = 2;
  }
}

main(process.argv[2]).catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
