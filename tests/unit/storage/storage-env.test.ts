import { afterEach, describe, expect, it, vi } from "vitest";

// The storage settings are checked once, with a message naming the variable at fault.
async function envWith(vars: Record<string, string | undefined>) {
  vi.resetModules();
  for (const [k, v] of Object.entries(vars)) vi.stubEnv(k, v);
  const { env } = await import("@/lib/env");
  return env;
}
afterEach(() => vi.unstubAllEnvs());

describe("storage configuration", () => {
  it("defaults to the local folder", async () => {
    const env = await envWith({ STORAGE: undefined });
    expect(env()).toMatchObject({ STORAGE: "local", UPLOAD_DIR: "./data/uploads", S3_PREFIX: "", S3_FORCE_PATH_STYLE: "off" });
  });
  it("needs a bucket for STORAGE=s3", async () => {
    const env = await envWith({ STORAGE: "s3", S3_BUCKET: undefined });
    expect(() => env()).toThrow(/S3_BUCKET: is required when STORAGE=s3/);
  });
  it("needs both keys or neither", async () => {
    const env = await envWith({ STORAGE: "s3", S3_BUCKET: "plant-files", S3_ACCESS_KEY_ID: "AKIAEXAMPLE", S3_SECRET_ACCESS_KEY: undefined });
    expect(() => env()).toThrow(/S3_SECRET_ACCESS_KEY: set S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY together/);
  });
  it("refuses a prefix that could leave its folder", async () => {
    const env = await envWith({ STORAGE: "s3", S3_BUCKET: "plant-files", S3_PREFIX: "../other/" });
    expect(() => env()).toThrow(/S3_PREFIX/);
  });
  it("accepts a full S3-compatible configuration", async () => {
    const env = await envWith({ STORAGE: "s3", S3_BUCKET: "plant-files", S3_ENDPOINT: "http://127.0.0.1:9000", S3_REGION: "eu-west-1", S3_ACCESS_KEY_ID: "a", S3_SECRET_ACCESS_KEY: "b", S3_FORCE_PATH_STYLE: "on", S3_PREFIX: "ovenward/files/" });
    expect(env()).toMatchObject({ STORAGE: "s3", S3_BUCKET: "plant-files", S3_FORCE_PATH_STYLE: "on", S3_PREFIX: "ovenward/files/" });
  });
});
