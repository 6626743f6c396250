import { execFileSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { startBuiltApp } from "../support/app-process";

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
  const app = await startBuiltApp({
    name: "the app",
    port,
    logFile: path.join(path.dirname(uploadDir), `app-${port}-${path.basename(uploadDir)}.log`),
    env: {
      DATABASE_URL: databaseUrl, UPLOAD_DIR: uploadDir, SCHEDULER: "off", SMTP_SINK: "off", DEMO_MODE: "off", AUTH_SECRET: "benchmark-only-secret-0123456789abcdef",
      // One token drives every connection of the load: the per-token limit would answer 429.
      API_RATE_LIMIT_PER_MINUTE: "0",
    },
  });
  return { base: app.url, cpuMs: () => treeCpuMs(app.child.pid!), stop: () => app.stop() };
}
