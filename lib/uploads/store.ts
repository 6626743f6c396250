import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import { createHash } from "node:crypto";
import { AppError } from "@/lib/errors";
import { env } from "@/lib/env";
import { writeFileDurably } from "@/lib/storage/file-store";
import { MAX_UPLOAD_BYTES, sniffFileType } from "./file-type";

// Photos and documents attached to work orders and changes: checked by their bytes (not their
// name), at most 10 MB, stored once under their SHA-256 (so a path can never come from the user).

export function uploadPath(sha256: string) {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error("not a content hash");
  return path.resolve(env().UPLOAD_DIR, sha256);
}

export async function storeSniffedUpload(file: { name: string; bytes: Uint8Array }) {
  if (file.bytes.byteLength === 0) throw new AppError("invalid_file", "file: the file is empty.", { fields: { file: "is empty" } });
  if (file.bytes.byteLength > MAX_UPLOAD_BYTES) {
    throw new AppError("file_too_large", `file: ${(file.bytes.byteLength / 1048576).toFixed(1)} MB is over the 10 MB limit; send a smaller photo.`, { fields: { file: "over 10 MB" } });
  }
  const type = sniffFileType(file.bytes);
  if (!type) throw new AppError("unsupported_file", "file: only JPEG, PNG or WebP photos and PDF documents can be attached.", { fields: { file: "not a JPEG, PNG, WebP or PDF" } });
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  // Never rewrite a file that is already there: rows may refer to it, and a crash half-way
  // through an overwrite would leave them pointing at a truncated copy.
  const target = uploadPath(sha256);
  const exists = await fs.access(target).then(() => true, () => false);
  if (!exists) writeFileDurably(target, file.bytes);
  const fileName = file.name.replace(/[^\w.\- ]+/g, "_").slice(0, 120) || `upload.${type.ext}`;
  return { sha256, fileName, contentType: type.contentType, sizeBytes: file.bytes.byteLength };
}

export async function readStoredUpload(sha256: string) {
  return fs.readFile(uploadPath(sha256)).catch(() => null);
}
