import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";

// The built app started the way production starts it (scripts/serve.mts: migrations, SMTP sink,
// scheduler, then `next start`), in its own process group so one SIGKILL takes every process of
// it down at once, as a power cut or the OOM killer would.

export type AppConfig = { databaseUrl: string; uploadDir: string; port: number; smtpPort: number; logFile: string };

export type AppProcess = { child: ChildProcess; exited: Promise<number | null>; baseUrl: string };

export async function startApp(cfg: AppConfig): Promise<AppProcess> {
  const log = fs.openSync(cfg.logFile, "a");
  const baseUrl = `http://localhost:${cfg.port}`;
  const child = spawn(process.execPath, ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/serve.mts"], {
    detached: true,
    stdio: ["ignore", log, log],
    env: {
      ...process.env,
      NODE_ENV: "production",
      DATABASE_URL: cfg.databaseUrl,
      UPLOAD_DIR: cfg.uploadDir,
      PORT: String(cfg.port),
      AUTH_URL: baseUrl,
      AUTH_SECRET: "crash-test-secret-0123456789abcdef",
      SMTP_SINK: "on",
      SMTP_SINK_PORT: String(cfg.smtpPort),
      SMTP_URL: `smtp://127.0.0.1:${cfg.smtpPort}`,
      SCHEDULER: "on",
      DEMO_MODE: "off",
    },
  });
  fs.closeSync(log);
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  const app = { child, exited, baseUrl };
  const deadline = Date.now() + 90_000;
  for (;;) {
    const res = await fetch(`${baseUrl}/api/health`).catch(() => null);
    if (res?.ok) return app;
    if (child.exitCode !== null) throw new Error(`The app exited (code ${child.exitCode}) before answering; see ${cfg.logFile}.`);
    if (Date.now() > deadline) {
      killApp(app, "SIGKILL");
      throw new Error(`The app did not answer /api/health within 90 s; see ${cfg.logFile}.`);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Signals the app's whole process group (serve.mts and the `next start` it spawned). */
export function killApp(app: AppProcess, signal: NodeJS.Signals) {
  try {
    process.kill(-app.child.pid!, signal);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "ESRCH") throw err;
  }
}

/** SIGKILLs the group and waits until the processes are gone, so the next start finds the files free. */
export async function crashApp(app: AppProcess) {
  killApp(app, "SIGKILL");
  await app.exited;
  await groupGone(app);
}

// `next start` is a grandchild; wait until no process of the group is left.
async function groupGone(app: AppProcess) {
  for (let i = 0; i < 300; i++) {
    if (!groupAlive(app.child.pid!)) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`Processes of the app (group ${app.child.pid}) are still running.`);
}

export async function stopApp(app: AppProcess) {
  killApp(app, "SIGTERM");
  const timer = setTimeout(() => killApp(app, "SIGKILL"), 10_000);
  await app.exited;
  await groupGone(app);
  clearTimeout(timer);
}

/** Whether a live (not zombie) process of the group remains; an orphaned zombie holds no files. */
function groupAlive(pgid: number): boolean {
  if (!fs.existsSync("/proc/self/stat")) {
    try {
      process.kill(-pgid, 0);
      return true;
    } catch {
      return false;
    }
  }
  for (const pid of fs.readdirSync("/proc").filter((d) => /^\d+$/.test(d))) {
    let stat: string;
    try {
      stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    } catch {
      continue;
    }
    // pid (comm) state ppid pgrp … — comm may hold spaces, so split after its closing parenthesis.
    const [state, , pgrp] = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    if (Number(pgrp) === pgid && state !== "Z") return true;
  }
  return false;
}
