import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GetObjectCommand, ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { eq } from "drizzle-orm";
import { createTestDb } from "./test-db";
import { createApiToken } from "@/db/queries/api-tokens";
import { getUserByEmail } from "@/db/queries/users";
import { ovens } from "@/db/schema/fleet";
import { storedFiles } from "@/db/schema/files";
import { createBlobStore } from "@/lib/storage/blob-store";
import { sha256Hex } from "@/lib/storage/content-hash";
import { startFakeS3, type FakeS3 } from "@/scripts/support/fake-s3";

// The S3-compatible driver against a real S3 protocol server (s3rver on loopback): the driver's
// four operations, then uploads through the real route handlers landing in the bucket.
vi.mock("@/lib/auth", () => ({ auth: async () => null }));

let s3: FakeS3;
let t: Awaited<ReturnType<typeof createTestDb>>;
let raw: S3Client;
let token: string;
const PREFIX = "plant-a/";

beforeAll(async () => {
  s3 = await startFakeS3({ bucket: "ovenward-files" });
  Object.assign(process.env, s3.env, { S3_PREFIX: PREFIX });
  raw = new S3Client({ region: "us-east-1", endpoint: s3.endpoint, forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });
  t = await createTestDb();
  process.env.DATABASE_URL = t.url;
  const tech = await getUserByEmail(t.db, "tech@brightwater.example");
  token = (await createApiToken(t.db, { userId: tech!.id, name: "s3-test" }, null)).secret;
});
afterAll(async () => {
  raw?.destroy();
  t?.close();
  await s3?.close();
});

const keysInBucket = async () => ((await raw.send(new ListObjectsV2Command({ Bucket: s3.bucket }))).Contents ?? []).map((o) => o.Key);
const objectBytes = async (key: string) => Buffer.from(await (await raw.send(new GetObjectCommand({ Bucket: s3.bucket, Key: key }))).Body!.transformToByteArray());

describe("S3-compatible driver", () => {
  const store = () => createBlobStore({ STORAGE: "s3", UPLOAD_DIR: "unused", S3_BUCKET: s3.bucket, S3_ENDPOINT: s3.endpoint, S3_REGION: "us-east-1", S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER", S3_FORCE_PATH_STYLE: "on", S3_PREFIX: "driver/" });
  const bytes = new TextEncoder().encode("Time,TC1\n0,25.0\n1,26.5\n");
  const sha = sha256Hex(bytes);

  it("puts once under <prefix><2 hex>/<sha>, gets the same bytes, tells existence, deletes", async () => {
    const s = store();
    expect(s.kind).toBe("s3");
    expect(await s.exists(sha)).toBe(false);
    expect(await s.get(sha)).toBeNull();
    expect(await s.put(sha, bytes)).toEqual({ created: true });
    expect(await keysInBucket()).toContain(`driver/${sha.slice(0, 2)}/${sha}`);
    expect(await objectBytes(`driver/${sha.slice(0, 2)}/${sha}`)).toEqual(Buffer.from(bytes));
    expect(await s.put(sha, bytes)).toEqual({ created: false });
    expect(await s.exists(sha)).toBe(true);
    expect(await s.get(sha)).toEqual(Buffer.from(bytes));
    await s.delete(sha);
    expect(await s.exists(sha)).toBe(false);
    expect(await s.get(sha)).toBeNull();
    await expect(s.delete(sha)).resolves.toBeUndefined();
  });

  it("builds no key from anything but a content hash", async () => {
    await expect(store().get("../../other-bucket/secret")).rejects.toThrow(/Not a content hash/);
    await expect(store().put("x".repeat(64), bytes)).rejects.toThrow(/Not a content hash/);
  });

  it("reports refused credentials as an error, not as a missing file", async () => {
    // s3rver checks the access key (it does not verify V4 signatures), so an unknown key is the refusal here.
    const wrong = createBlobStore({ STORAGE: "s3", UPLOAD_DIR: "unused", S3_BUCKET: s3.bucket, S3_ENDPOINT: s3.endpoint, S3_REGION: "us-east-1", S3_ACCESS_KEY_ID: "NOT-A-KEY", S3_SECRET_ACCESS_KEY: "whatever", S3_FORCE_PATH_STYLE: "on", S3_PREFIX: "" });
    await expect(wrong.get(sha)).rejects.toMatchObject({ name: "InvalidAccessKeyId" });
    await expect(wrong.exists(sha)).rejects.toMatchObject({ $metadata: { httpStatusCode: 403 } });
  });
});

describe("uploads through the route handlers land in the bucket", () => {
  const call = (handler: unknown, url: string, init: RequestInit, params: Record<string, string>) =>
    (handler as (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>)(
      new Request(`http://localhost${url}`, { ...init, headers: { authorization: `Bearer ${token}` } }),
      { params: Promise.resolve(params) },
    );

  it("a recorded run's logger file is stored by hash in the bucket and downloaded from it", async () => {
    const { POST } = await import("@/app/api/v1/ovens/[ovenId]/runs/route");
    const { GET } = await import("@/app/api/v1/runs/[runId]/file/route");
    const [oven] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L1-RF1"));
    const csv = fs.readFileSync(path.join("tests/fixtures/logger-files", "generic-8ch.csv"));
    const form = new FormData();
    form.set("file", new File([csv], "s3-run.csv", { type: "text/csv" }));
    const res = await call(POST, `/api/v1/ovens/${oven.id}/runs`, { method: "POST", body: form }, { ovenId: String(oven.id) });
    expect(res.status).toBe(201);
    const run = await res.json();
    const sha = sha256Hex(csv);
    const key = `${PREFIX}${sha.slice(0, 2)}/${sha}`;
    expect(await keysInBucket()).toContain(key);
    expect(await objectBytes(key)).toEqual(csv);
    expect((await t.db.select().from(storedFiles).where(eq(storedFiles.sha256, sha)))[0].path).toBe(`${sha.slice(0, 2)}/${sha}`);
    const down = await call(GET, `/api/v1/runs/${run.id}/file`, { method: "GET" }, { runId: String(run.id) });
    expect(down.status).toBe(200);
    expect(Buffer.from(await down.arrayBuffer())).toEqual(csv);
  });

  it("a work-order photo is checked by its bytes, stored in the bucket, and served back", async () => {
    const { POST } = await import("@/app/api/v1/work-orders/[workOrderId]/attachments/route");
    const { GET } = await import("@/app/api/v1/attachments/[attachmentId]/route");
    const { workOrders } = await import("@/db/schema/maintenance");
    const [order] = await t.db.select({ id: workOrders.id }).from(workOrders).limit(1);
    const png = fs.readFileSync("tests/fixtures/checklist-photo.png");
    const form = new FormData();
    form.set("file", new File([png], "belt.png", { type: "image/png" }));
    const res = await call(POST, `/api/v1/work-orders/${order.id}/attachments`, { method: "POST", body: form }, { workOrderId: String(order.id) });
    expect(res.status).toBe(201);
    const saved = await res.json();
    expect(saved.sha256).toBe(sha256Hex(png));
    expect(await objectBytes(`${PREFIX}${saved.sha256.slice(0, 2)}/${saved.sha256}`)).toEqual(png);
    const down = await call(GET, `/api/v1/attachments/${saved.id}`, { method: "GET" }, { attachmentId: String(saved.id) });
    expect(down.status).toBe(200);
    expect(down.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await down.arrayBuffer())).toEqual(png);
    // Not a photo by its bytes: refused before anything reaches the bucket.
    const before = (await keysInBucket()).length;
    const bad = new FormData();
    bad.set("file", new File(["<svg/>"], "x.png", { type: "image/png" }));
    const refused = await call(POST, `/api/v1/work-orders/${order.id}/attachments`, { method: "POST", body: bad }, { workOrderId: String(order.id) });
    expect(refused.status).toBe(415);
    expect((await keysInBucket()).length).toBe(before);
  });
});
