// The project's own PostgreSQL on loopback: Debian's server binaries, a cluster in a git-ignored
// folder, a non-default port. Used by the start command, the tests and `npm run db:stop`.
// Node-only; never imported by the web app.
import { execFileSync, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { chmodSync, chownSync, existsSync, mkdirSync, readFileSync, readdirSync, rmSync } from "node:fs";
import path from "node:path";
import postgres from "postgres";

export interface LocalCluster {
  binDir: string;
  dataDir: string;
  port: number;
  /** run server commands as this system user (set when we are root) */
  runAs: string | null;
}

const projectRoot = () => path.resolve(process.env.LOOPWRIGHT_ROOT ?? process.cwd());
const isRoot = () => typeof process.getuid === "function" && process.getuid() === 0;
const log = (msg: string) => console.log(`[postgres] ${msg}`);

/** Finds Debian's server binaries; as root installs the `postgresql` package when they are missing. */
export function findServerBinaries(): string {
  const lookup = () => {
    const base = "/usr/lib/postgresql";
    if (!existsSync(base)) return null;
    const versions = readdirSync(base)
      .filter((v) => existsSync(path.join(base, v, "bin", "pg_ctl")))
      .sort((a, b) => Number(b) - Number(a));
    return versions.length ? path.join(base, versions[0], "bin") : null;
  };
  const found = lookup();
  if (found) return found;
  if (!isRoot()) {
    throw new Error(
      "PostgreSQL server binaries not found under /usr/lib/postgresql/*/bin. Install Debian's package " +
        "(sudo apt-get install -y postgresql) or set DATABASE_URL to an existing database.",
    );
  }
  log("server binaries missing; installing Debian's postgresql package with apt-get");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-q"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-q", "--no-install-recommends", "postgresql"], { stdio: "inherit", env });
  const installed = lookup();
  if (!installed) throw new Error("apt-get installed postgresql but no pg_ctl was found under /usr/lib/postgresql");
  return installed;
}

/** A port per checkout, so two clones on one machine never fight over one cluster. */
function defaultPort(root: string): number {
  const h = createHash("sha256").update(root).digest().readUInt16BE(0);
  return 54330 + (h % 600);
}

function canSystemUserEnter(user: string, dir: string): boolean {
  return spawnSync("runuser", ["-u", user, "--", "test", "-x", dir, "-a", "-w", dir], { stdio: "ignore" }).status === 0;
}

/** Where the cluster lives and who runs it. */
export function resolveCluster(): LocalCluster {
  const root = projectRoot();
  const binDir = findServerBinaries();
  const port = Number(process.env.LOOPWRIGHT_PG_PORT ?? defaultPort(root));
  let dataDir = path.join(root, ".data", "postgres");
  let runAs: string | null = null;
  if (isRoot()) {
    // The server refuses to run as root: run it as Debian's postgres system user.
    runAs = "postgres";
    mkdirSync(path.dirname(dataDir), { recursive: true });
    if (!canSystemUserEnterAfterPrep(runAs, dataDir)) {
      // The checkout sits where postgres cannot enter (a clone under /root): keep the cluster in a
      // folder that user owns, one per checkout.
      const id = createHash("sha256").update(root).digest("hex").slice(0, 12);
      dataDir = path.join("/var/lib/postgresql/loopwright", id);
      log(`the postgres user cannot enter ${root}; keeping this checkout's cluster in ${dataDir}`);
    }
  }
  return { binDir, dataDir, port, runAs };
}

function canSystemUserEnterAfterPrep(user: string, dataDir: string): boolean {
  mkdirSync(dataDir, { recursive: true });
  const { uid, gid } = systemUserIds(user);
  chownSync(dataDir, uid, gid);
  chmodSync(dataDir, 0o700);
  return canSystemUserEnter(user, dataDir);
}

function systemUserIds(user: string): { uid: number; gid: number } {
  const uid = Number(execFileSync("id", ["-u", user]).toString().trim());
  const gid = Number(execFileSync("id", ["-g", user]).toString().trim());
  return { uid, gid };
}

function run(cluster: LocalCluster, binary: string, args: string[], opts: { check?: boolean } = {}) {
  const exe = path.join(cluster.binDir, binary);
  const [cmd, argv] = cluster.runAs ? ["runuser", ["-u", cluster.runAs, "--", exe, ...args]] : [exe, args];
  const result = spawnSync(cmd, argv, { encoding: "utf8", cwd: "/" });
  if (opts.check !== false && result.status !== 0) {
    throw new Error(`${binary} ${args.join(" ")} failed (${result.status}):\n${result.stdout}\n${result.stderr}`);
  }
  return result;
}

function isInitialized(dataDir: string) {
  return existsSync(path.join(dataDir, "PG_VERSION"));
}

/** The pid in postmaster.pid when that process is alive and is a postgres server; otherwise null. */
function livePostmasterPid(dataDir: string): number | null {
  const pidFile = path.join(dataDir, "postmaster.pid");
  if (!existsSync(pidFile)) return null;
  const pid = Number(readFileSync(pidFile, "utf8").split("\n")[0]);
  if (!Number.isInteger(pid) || pid <= 0) return null;
  try {
    const comm = readFileSync(`/proc/${pid}/comm`, "utf8").trim();
    return comm.startsWith("postgres") ? pid : null;
  } catch {
    return null;
  }
}

export function clusterUrl(cluster: LocalCluster, database: string): string {
  return `postgres://postgres@127.0.0.1:${cluster.port}/${database}`;
}

/** Starts the cluster (initialising it on first use); harmless when it already runs. */
export function startCluster(cluster: LocalCluster): void {
  mkdirSync(cluster.dataDir, { recursive: true });
  if (cluster.runAs) {
    const { uid, gid } = systemUserIds(cluster.runAs);
    chownSync(cluster.dataDir, uid, gid);
  }
  chmodSync(cluster.dataDir, 0o700);
  if (!isInitialized(cluster.dataDir)) {
    log(`initialising a cluster in ${cluster.dataDir}`);
    run(cluster, "initdb", ["-D", cluster.dataDir, "-U", "postgres", "--auth=trust", "-E", "UTF8", "--locale=C.UTF-8"]);
  }
  if (livePostmasterPid(cluster.dataDir)) return;
  // A crash leaves postmaster.pid behind with a dead (or reused) pid: it must not block a start.
  rmSync(path.join(cluster.dataDir, "postmaster.pid"), { force: true });
  const options = `-p ${cluster.port} -c listen_addresses=127.0.0.1 -c unix_socket_directories=''`;
  log(`starting on 127.0.0.1:${cluster.port}`);
  run(cluster, "pg_ctl", ["-D", cluster.dataDir, "-l", path.join(cluster.dataDir, "server.log"), "-w", "-t", "60", "-o", options, "start"]);
}

export function stopCluster(cluster: LocalCluster): boolean {
  if (!isInitialized(cluster.dataDir) || !livePostmasterPid(cluster.dataDir)) return false;
  run(cluster, "pg_ctl", ["-D", cluster.dataDir, "-m", "fast", "-w", "stop"]);
  return true;
}

export async function createDatabaseIfMissing(adminUrl: string, name: string): Promise<void> {
  const sql = postgres(adminUrl, { max: 1, onnotice: () => {} });
  try {
    const rows = await sql`select 1 from pg_database where datname = ${name}`;
    if (rows.length === 0) await sql.unsafe(`create database "${name.replace(/"/g, '""')}"`);
  } finally {
    await sql.end();
  }
}

export async function dropDatabase(adminUrl: string, name: string): Promise<void> {
  const sql = postgres(adminUrl, { max: 1, onnotice: () => {} });
  try {
    await sql.unsafe(`drop database if exists "${name.replace(/"/g, '""')}" with (force)`);
  } finally {
    await sql.end();
  }
}

/**
 * The database URL for this process: DATABASE_URL when set, otherwise the local cluster (started
 * here) with the named database created on it.
 */
export async function ensureLocalDatabase(database = "loopwright"): Promise<{ url: string; adminUrl: string | null }> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, adminUrl: null };
  const cluster = resolveCluster();
  startCluster(cluster);
  const adminUrl = clusterUrl(cluster, "postgres");
  await createDatabaseIfMissing(adminUrl, database);
  return { url: clusterUrl(cluster, database), adminUrl };
}
