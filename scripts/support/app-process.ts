import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";

// Processes the test and benchmark scripts start and stop: the built app the way production
// starts it (scripts/serve.mts: migrations, optional SMTP sink and scheduler, then `next start`),
// and helpers such as the libSQL server. Each runs in its own process group, so one signal
// reaches every process of it (serve.mts and the `next start` it spawned) at once — as a power
// cut or the OOM killer would for the crash test.

export type Started = {
  name: string;
  child: ChildProcess;
  log: string;
  exited: Promise<number | null>;
  hasExited(): boolean;
  /** The last lines of its log, indented, for error messages. */
  tail(lines?: number): string;
  /** Signals the whole process group. */
  kill(signal: NodeJS.Signals): void;
  /** SIGKILL, then wait until no live process of the group is left (its files are free again). */
  crash(): Promise<void>;
  /** SIGTERM (SIGKILL after 10 s), then wait until the group is gone. */
  stop(): Promise<void>;
};

export function startProcess(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv, logFile: string): Started {
  const out = fs.openSync(logFile, "a");
  const child = spawn(cmd, args, { env, detached: true, stdio: ["ignore", out, out] });
  fs.closeSync(out);
  let done = false;
  const exited = new Promise<number | null>((resolve) =>
    child.once("exit", (code) => {
      done = true;
      resolve(code);
    }),
  );
  const kill = (signal: NodeJS.Signals) => {
    try {
      process.kill(-child.pid!, signal);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== "ESRCH") throw err;
    }
  };
  return {
    name,
    child,
    log: logFile,
    exited,
    hasExited: () => done,
    tail: (lines = 30) => (fs.existsSync(logFile) ? fs.readFileSync(logFile, "utf8").trimEnd().split("\n").slice(-lines).map((l) => `  | ${l}`).join("\n") : ""),
    kill,
    async crash() {
      kill("SIGKILL");
      await exited;
      await groupGone(child.pid!);
    },
    async stop() {
      kill("SIGTERM");
      const force = setTimeout(() => kill("SIGKILL"), 10_000);
      await exited;
      await groupGone(child.pid!);
      clearTimeout(force);
    },
  };
}

/** Polls a URL until it answers 2xx; fails early when the process behind it stops. */
export async function waitFor(what: string, url: string, timeoutMs: number, proc?: Started): Promise<Response> {
  const until = Date.now() + timeoutMs;
  let last = "no answer";
  while (Date.now() < until) {
    if (proc?.hasExited()) throw new Error(`${what} stopped before it answered (exit ${proc.child.exitCode}); its log:\n${proc.tail()}`);
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2_000) });
      if (res.ok) return res;
      last = `HTTP ${res.status}`;
    } catch (e) {
      last = (e as Error).message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  proc?.kill("SIGKILL");
  throw new Error(`${what} did not answer ${url} within ${timeoutMs / 1000} s (${last}).${proc ? `\n${proc.tail()}` : ""}`);
}

/**
 * The production build (`next build` first) on `port`, with `env` over this process's own, once it
 * answers /api/health. Its address uses localhost, as people open it (AUTH_URL): sign-in cookies
 * are issued for that host.
 */
export async function startBuiltApp({ name, port, env, logFile, timeoutMs = 120_000 }: { name: string; port: number; env: Record<string, string>; logFile: string; timeoutMs?: number }) {
  const url = `http://localhost:${port}`;
  const proc = startProcess(
    name,
    process.execPath,
    ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/serve.mts"],
    { ...process.env, NODE_ENV: "production", AUTH_URL: url, ...env, PORT: String(port) },
    logFile,
  );
  await waitFor(name, `${url}/api/health`, timeoutMs, proc);
  return { ...proc, url };
}

export type BuiltApp = Awaited<ReturnType<typeof startBuiltApp>>;

// `next start` is a grandchild; wait until no live process of the group is left.
async function groupGone(pgid: number) {
  for (let i = 0; i < 300; i++) {
    if (!groupAlive(pgid)) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`Processes of group ${pgid} are still running.`);
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
