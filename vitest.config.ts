import { defineConfig } from "vitest/config";
import path from "node:path";

export default defineConfig({
  resolve: { alias: { "@": path.resolve(__dirname), "server-only": path.resolve(__dirname, "scripts/_shims/empty.mjs") } },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/reference/**/*.test.ts", "tests/integration/**/*.test.ts"],
    environment: "node",
    testTimeout: 30_000,
    hookTimeout: 60_000,
    pool: "forks",
    // next-auth imports "next/server" without an extension, which Node's ESM loader refuses; run it through Vite.
    server: { deps: { inline: ["next-auth"] } },
    env: { SMTP_SINK_PORT: process.env.VITEST_SMTP_PORT ?? "2727", SMTP_URL: `smtp://127.0.0.1:${process.env.VITEST_SMTP_PORT ?? "2727"}`, AUTH_URL: "http://localhost:3999" },
  },
});
