import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { localBlobStore } from "@/lib/storage/local-driver";
import { contentKey, sha256Hex } from "@/lib/storage/content-hash";
import { createBlobStore, storeContent } from "@/lib/storage/blob-store";

const root = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-blobs-"));
afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

describe("content hash", () => {
  it("is the SHA-256 of the bytes (FIPS 180-2 appendix B.1: 'abc')", () => {
    expect(sha256Hex(new TextEncoder().encode("abc"))).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
  it("refuses anything that is not a lower-case hex SHA-256, so no key can climb out of the store", () => {
    for (const bad of ["../../etc/passwd", "ab/../../x", "A".repeat(64), "a".repeat(63), `${"a".repeat(64)}/`, "", "..%2f" + "a".repeat(59)]) {
      expect(() => contentKey(bad)).toThrow(/Not a content hash/);
    }
    expect(contentKey("ab" + "0".repeat(62))).toBe(`ab/ab${"0".repeat(62)}`);
  });
});

describe("local folder driver", () => {
  const store = localBlobStore(root);
  const bytes = new TextEncoder().encode("Time,TC1\n0,25.0\n");
  const sha = sha256Hex(bytes);

  it("puts under <2 hex>/<sha>, once; gets, tells existence, deletes", async () => {
    expect(await store.exists(sha)).toBe(false);
    expect(await store.get(sha)).toBeNull();
    expect(await store.put(sha, bytes)).toEqual({ created: true });
    expect(fs.readFileSync(path.join(root, sha.slice(0, 2), sha))).toEqual(Buffer.from(bytes));
    expect(await store.put(sha, bytes)).toEqual({ created: false });
    expect(await store.exists(sha)).toBe(true);
    expect(await store.get(sha)).toEqual(Buffer.from(bytes));
    // No temporary file is left beside it.
    expect(fs.readdirSync(path.join(root, sha.slice(0, 2)))).toEqual([sha]);
    await store.delete(sha);
    expect(await store.exists(sha)).toBe(false);
    await expect(store.delete(sha)).resolves.toBeUndefined();
  });

  it("still reads and removes attachments written flat (<sha>) before the layouts were merged", async () => {
    const old = crypto.randomBytes(32);
    const oldSha = sha256Hex(old);
    fs.writeFileSync(path.join(root, oldSha), old);
    expect(await store.exists(oldSha)).toBe(true);
    expect(await store.get(oldSha)).toEqual(old);
    expect(await store.put(oldSha, old)).toEqual({ created: false });
    await store.delete(oldSha);
    expect(fs.existsSync(path.join(root, oldSha))).toBe(false);
  });

  it("refuses a traversal attempt in every operation", async () => {
    const evil = "../".repeat(5) + "etc/passwd";
    await expect(store.get(evil)).rejects.toThrow(/Not a content hash/);
    await expect(store.exists(evil)).rejects.toThrow(/Not a content hash/);
    await expect(store.delete(evil)).rejects.toThrow(/Not a content hash/);
    await expect(store.put(evil, new Uint8Array([1]))).rejects.toThrow(/Not a content hash/);
  });

  it("storeContent names the bytes by their hash and returns the key kept on stored_file rows", async () => {
    const s = createBlobStore({ STORAGE: "local", UPLOAD_DIR: root, S3_REGION: "us-east-1", S3_FORCE_PATH_STYLE: "off", S3_PREFIX: "" });
    const r = await storeContent(bytes, s);
    expect(r).toEqual({ sha256: sha, path: `${sha.slice(0, 2)}/${sha}`, created: true });
  });
});
