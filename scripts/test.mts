// npm test: every test. Unit, reference and integration tests (vitest), then a production build
// and the end-to-end tests in Chromium (Playwright). Installs Debian's chromium when it is missing.
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";

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
step("End-to-end tests in Chromium", node, ["node_modules/@playwright/test/cli.js", "test"]);
console.log("\nAll test stages passed.");
