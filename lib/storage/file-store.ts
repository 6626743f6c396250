import "server-only";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { env } from "@/lib/env";

/**
 * Content-addressed storage under UPLOAD_DIR: a file is named by its SHA-256, never by the name
 * the user gave it, so two uploads of the same bytes share one copy and no path is user-chosen.
 */
export function uploadRoot(): string {
  return path.resolve(env().UPLOAD_DIR);
}

export function sha256Hex(bytes: Uint8Array): string {
  return crypto.createHash("sha256").update(bytes).digest("hex");
}

export function relativePathFor(sha: string): string {
  return path.join(sha.slice(0, 2), sha);
}

/** Writes the bytes unless a file with that hash is already there; returns the relative path. */
export function writeContent(bytes: Uint8Array, sha = sha256Hex(bytes)): { sha256: string; path: string; created: boolean } {
  const rel = relativePathFor(sha);
  const abs = path.join(uploadRoot(), rel);
  if (fs.existsSync(abs)) return { sha256: sha, path: rel, created: false };
  fs.mkdirSync(path.dirname(abs), { recursive: true });
  // Write to a temporary name first so a crash never leaves a half file under the hash.
  const tmp = `${abs}.${process.pid}.${Date.now()}.tmp`;
  fs.writeFileSync(tmp, bytes);
  fs.renameSync(tmp, abs);
  return { sha256: sha, path: rel, created: true };
}

export function readContent(rel: string): Buffer | null {
  const abs = path.join(uploadRoot(), rel);
  if (!abs.startsWith(uploadRoot() + path.sep)) return null;
  try {
    return fs.readFileSync(abs);
  } catch {
    return null;
  }
}

export function removeContent(rel: string): void {
  const abs = path.join(uploadRoot(), rel);
  if (!abs.startsWith(uploadRoot() + path.sep)) return;
  fs.rmSync(abs, { force: true });
}

/** Magic bytes of the certificate formats accepted. */
export function sniffCertificate(bytes: Uint8Array): "application/pdf" | "image/png" | "image/jpeg" | null {
  if (bytes.length >= 5 && bytes[0] === 0x25 && bytes[1] === 0x50 && bytes[2] === 0x44 && bytes[3] === 0x46 && bytes[4] === 0x2d) return "application/pdf";
  if (bytes.length >= 8 && bytes[0] === 0x89 && bytes[1] === 0x50 && bytes[2] === 0x4e && bytes[3] === 0x47 && bytes[4] === 0x0d && bytes[5] === 0x0a && bytes[6] === 0x1a && bytes[7] === 0x0a) return "image/png";
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return "image/jpeg";
  return null;
}
export const MAX_CERTIFICATE_BYTES = 10 * 1024 * 1024;
