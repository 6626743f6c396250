// npm run demo: migrate, seed the Brightwater demo, build, and start the app with its SMTP sink.
import { execFileSync } from "node:child_process";

process.env.DEMO_MODE ??= "on";
process.env.SMTP_SINK ??= "on";
(process.env as Record<string, string>).NODE_ENV = "production";

const run = (args: string[]) => execFileSync(process.execPath, args, { stdio: "inherit", env: process.env });

run(["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/seed.mts"]);
run(["node_modules/next/dist/bin/next", "build"]);
await import("./serve" + ".mts");
