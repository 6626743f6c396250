/*
 * What an uploaded file really is, from its first bytes (the name and the browser's claimed
 * type are not trusted). Only photos and PDF documents are accepted on work orders.
 */

export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

export type SniffedType = { contentType: "image/jpeg" | "image/png" | "image/webp" | "application/pdf"; ext: string };

const startsWith = (b: Uint8Array, sig: number[], at = 0) => sig.every((v, i) => b[at + i] === v);

export function sniffFileType(bytes: Uint8Array): SniffedType | null {
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return { contentType: "image/jpeg", ext: "jpg" };
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { contentType: "image/png", ext: "png" };
  // RIFF....WEBP
  if (startsWith(bytes, [0x52, 0x49, 0x46, 0x46]) && startsWith(bytes, [0x57, 0x45, 0x42, 0x50], 8)) return { contentType: "image/webp", ext: "webp" };
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return { contentType: "application/pdf", ext: "pdf" };
  return null;
}

/** Calibration certificates: PDF, PNG or JPEG only (a WebP is a photo, not a certificate), at most 10 MB. */
export function sniffCertificate(bytes: Uint8Array): "application/pdf" | "image/png" | "image/jpeg" | null {
  const type = sniffFileType(bytes)?.contentType;
  return type && type !== "image/webp" ? type : null;
}
export const MAX_CERTIFICATE_BYTES = MAX_UPLOAD_BYTES;
