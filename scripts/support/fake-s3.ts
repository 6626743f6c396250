// A local S3-compatible server (s3rver) with one bucket, for development (`npm run fake-s3`), the
// storage integration test and the deployment test. Its fixed keys are S3RVER/S3RVER (it checks the
// access key, not V4 signatures).
import { createRequire } from "node:module";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

type S3rverInstance = { run(): Promise<{ port: number }>; close(): Promise<void> };
type S3rverClass = new (options: Record<string, unknown>) => S3rverInstance;

export const FAKE_S3_KEYS = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } as const;

export type FakeS3 = { endpoint: string; port: number; bucket: string; dir: string; env: Record<string, string>; close(): Promise<void> };

/** Starts the server on 127.0.0.1 (port 0 = any free port); its objects live under `dir`. */
export async function startFakeS3({ port = 0, bucket = "ovenward-test", dir }: { port?: number; bucket?: string; dir?: string } = {}): Promise<FakeS3> {
  const S3rver = createRequire(import.meta.url)("s3rver") as S3rverClass;
  const own = !dir;
  const folder = dir ?? fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-fake-s3-"));
  fs.mkdirSync(folder, { recursive: true });
  const server = new S3rver({ address: "127.0.0.1", port, silent: true, directory: folder, configureBuckets: [{ name: bucket }] });
  const bound = await server.run();
  const endpoint = `http://127.0.0.1:${bound.port}`;
  return {
    endpoint,
    port: bound.port,
    bucket,
    dir: folder,
    env: {
      STORAGE: "s3", S3_BUCKET: bucket, S3_ENDPOINT: endpoint, S3_REGION: "us-east-1", S3_FORCE_PATH_STYLE: "on",
      S3_ACCESS_KEY_ID: FAKE_S3_KEYS.accessKeyId, S3_SECRET_ACCESS_KEY: FAKE_S3_KEYS.secretAccessKey,
    },
    async close() {
      await server.close();
      if (own) fs.rmSync(folder, { recursive: true, force: true });
    },
  };
}
