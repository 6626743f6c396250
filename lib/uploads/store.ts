import "server-only";
import { AppError } from "@/lib/errors";
import { storeContent } from "@/lib/storage/blob-store";
import { MAX_UPLOAD_BYTES, sniffFileType } from "./file-type";

// Photos and documents attached to work orders and changes: checked by their bytes (not their
// name), at most 10 MB, stored once under their SHA-256 (so a path can never come from the user).

export async function storeSniffedUpload(file: { name: string; bytes: Uint8Array }) {
  if (file.bytes.byteLength === 0) throw new AppError("invalid_file", "file: the file is empty.", { fields: { file: "is empty" } });
  if (file.bytes.byteLength > MAX_UPLOAD_BYTES) {
    throw new AppError("file_too_large", `file: ${(file.bytes.byteLength / 1048576).toFixed(1)} MB is over the 10 MB limit; send a smaller photo.`, { fields: { file: "over 10 MB" } });
  }
  const type = sniffFileType(file.bytes);
  if (!type) throw new AppError("unsupported_file", "file: only JPEG, PNG or WebP photos and PDF documents can be attached.", { fields: { file: "not a JPEG, PNG, WebP or PDF" } });
  const { sha256 } = await storeContent(file.bytes);
  const fileName = file.name.replace(/[^\w.\- ]+/g, "_").slice(0, 120) || `upload.${type.ext}`;
  return { sha256, fileName, contentType: type.contentType, sizeBytes: file.bytes.byteLength };
}
