import crypto from "node:crypto";

// The name of every stored file is its SHA-256: the only thing a path or key is built from.

const HASH = /^[0-9a-f]{64}$/;

/** Refuses anything but a lower-case SHA-256 in hex, so no path or key can leave the store. */
export function assertContentHash(sha256: string): void {
  if (typeof sha256 !== "string" || !HASH.test(sha256)) throw new Error(`Not a content hash: ${JSON.stringify(String(sha256).slice(0, 80))}`);
}

export function sha256Hex(bytes: Uint8Array): string {
  return crypto.createHash("sha256").update(bytes).digest("hex");
}

/** Where a hash lives inside a store: under a two-character folder, so no folder grows too large. */
export function contentKey(sha256: string): string {
  assertContentHash(sha256);
  return `${sha256.slice(0, 2)}/${sha256}`;
}
