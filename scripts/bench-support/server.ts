import { execFileSync, spawn } from "node:child_process";
import fs from "node:fs";

/** The production build the benchmark serves; builds it when there is none. */
export function ensureBuild() {
  if (fs.existsSync(".next/BUILD_ID")) {
    console.log(`Using the production build from ${fs.statSync(".next/BUILD_ID").mtime.toISOString()} (run "npm run build" after changing code).`);
    return;
  }
  console.log('No production build (.next/BUILD_ID is missing): running "next build" first…');
  execFileSync(process.execPath, ["node_modules/next/dist/bin/next", "build"], { stdio: "inherit", env: { ...process.env, NODE_ENV: "production" } });
}

export type Server = { base: string; stop: () => Promise<void>; cpuMs: () => number | null };

/**
 * CPU time (user + system, ms) of a process and everything it started, from /proc: the app's
 * own work during a load, whatever else the machine is doing. Null where there is no /proc.
 */
function treeCpuMs(root: number): number | null {
  if (!fs.existsSync("/proc/self/stat")) return null;
  const stats = fs.readdirSync("/proc").filter((d) => /^\d+$/.test(d)).flatMap((d) => {
    try {
      const f = fs.readFileSync(`/proc/${d}/stat`, "utf8").split(") ")[1].split(" ");
      return [{ pid: Number(d), ppid: Number(f[1]), ticks: Number(f[11]) + Number(f[12]) }];
    } catch {
      return []; // gone meanwhile
    }
  });
  const inTree = new Set([root]);
  for (let grew = true; grew; ) {
    grew = false;
    for (const p of stats) {
      if (!inTree.has(p.pid) && inTree.has(p.ppid)) {
        inTree.add(p.pid);
        grew = true;
      }
    }
  }
  return stats.filter((p) => inTree.has(p.pid)).reduce((sum, p) => sum + p.ticks, 0) * 10; // USER_HZ is 100 on Linux
}

/**
 * Starts the built app the way `npm run serve` does, on its own database and upload folder, with
 * the scheduler and the SMTP sink off (a tick in the middle of a measurement is noise, not load).
 */
export async function startServer({ databaseUrl, port, uploadDir }: { databaseUrl: string; port: number; uploadDir: string }): Promise<Server> {
  const base = `http://localhost:${port}`;
  const child = spawn(process.execPath, ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/serve.mts"], {
    env: {
      ...process.env, NODE_ENV: "production", DATABASE_URL: databaseUrl, PORT: String(port), UPLOAD_DIR: uploadDir, SCHEDULER: "off", SMTP_SINK: "off",
      DEMO_MODE: "off", AUTH_SECRET: "benchmark-only-secret-0123456789abcdef", AUTH_URL: base,
      // One token drives every connection of the load: the per-token limit would answer 429.
      API_RATE_LIMIT_PER_MINUTE: "0",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout!.on("data", (d) => (output += d));
  child.stderr!.on("data", (d) => (output += d));
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  const deadline = Date.now() + 120_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The server exited (code ${child.exitCode}):\n${output}`);
    try {
      if ((await fetch(`${base}/api/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill("SIGTERM");
      throw new Error(`The server did not answer on ${base} within 2 minutes:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  return {
    base,
    cpuMs: () => treeCpuMs(child.pid!),
    stop: async () => {
      child.kill("SIGTERM");
      await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
      if (child.exitCode === null) child.kill("SIGKILL");
    },
  };
}
