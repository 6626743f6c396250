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
  writeFileDurably(abs, bytes);
  return { sha256: sha, path: rel, created: true };
}

/**
 * Writes a file so that its final name only ever holds the whole content: bytes go to a
 * temporary name, are flushed to disk, then renamed, and the folder entry is flushed too. The
 * database row that refers to the file is committed only after this returns, so neither a killed
 * process nor a power cut leaves a row pointing at a missing or half-written file.
 */
export function writeFileDurably(abs: string, bytes: Uint8Array): void {
  const dir = path.dirname(abs);
  fs.mkdirSync(dir, { recursive: true });
  const tmp = `${abs}.${crypto.randomUUID()}.tmp`;
  const fd = fs.openSync(tmp, "w");
  try {
    fs.writeSync(fd, bytes);
    fs.fsyncSync(fd);
  } finally {
    fs.closeSync(fd);
  }
  fs.renameSync(tmp, abs);
  syncFolder(dir);
}

function syncFolder(dir: string) {
  let fd: number | undefined;
  try {
    fd = fs.openSync(dir, "r");
    fs.fsyncSync(fd);
  } catch {
    // Some platforms (Windows) cannot open a folder for syncing; the rename is then as durable as the OS makes it.
  } finally {
    if (fd !== undefined) fs.closeSync(fd);
  }
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
