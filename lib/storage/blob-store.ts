import "server-only";
import { env, type Env } from "@/lib/env";
import { localBlobStore } from "./local-driver";
import { s3BlobStore } from "./s3-driver";
import { contentKey, sha256Hex } from "./content-hash";

/**
 * Every uploaded file (logger files, certificates, photos and documents) is kept under its
 * SHA-256 — never under a name the user gave — so two uploads of the same bytes share one copy
 * and no path or key can come from the user. Where the bytes live is a driver: a local folder
 * (one machine) or an S3-compatible bucket (several app instances share it).
 */
export interface BlobStore {
  readonly kind: "local" | "s3";
  /** Stores the bytes unless that hash is already there; `created` says whether this call wrote them. */
  put(sha256: string, bytes: Uint8Array): Promise<{ created: boolean }>;
  /** The bytes, or null when nothing is stored under that hash. */
  get(sha256: string): Promise<Buffer | null>;
  /** Removes the bytes; removing what is not there is not an error. */
  delete(sha256: string): Promise<void>;
  exists(sha256: string): Promise<boolean>;
}

export function createBlobStore(e: Pick<Env, "STORAGE" | "UPLOAD_DIR" | "S3_BUCKET" | "S3_ENDPOINT" | "S3_REGION" | "S3_ACCESS_KEY_ID" | "S3_SECRET_ACCESS_KEY" | "S3_FORCE_PATH_STYLE" | "S3_PREFIX">): BlobStore {
  if (e.STORAGE === "local") return localBlobStore(e.UPLOAD_DIR);
  return s3BlobStore({
    bucket: e.S3_BUCKET!,
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    credentials: e.S3_ACCESS_KEY_ID && e.S3_SECRET_ACCESS_KEY ? { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY } : undefined,
    forcePathStyle: e.S3_FORCE_PATH_STYLE === "on",
    prefix: e.S3_PREFIX,
  });
}

let cached: { from: Env; store: BlobStore } | undefined;

/** The store the configuration names; made again only if the settings were read afresh. */
export function blobStore(): BlobStore {
  const e = env();
  if (cached?.from !== e) cached = { from: e, store: createBlobStore(e) };
  return cached.store;
}

/** Hashes and stores the bytes; `path` is the key inside the store (kept on stored_file rows). */
export async function storeContent(bytes: Uint8Array, store = blobStore()): Promise<{ sha256: string; path: string; created: boolean }> {
  const sha256 = sha256Hex(bytes);
  const { created } = await store.put(sha256, bytes);
  return { sha256, path: contentKey(sha256), created };
}
