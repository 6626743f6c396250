import "server-only";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from "@aws-sdk/client-s3";
import type { BlobStore } from "./blob-store";
import { contentKey } from "./content-hash";

export type S3Config = {
  bucket: string;
  endpoint?: string;
  region: string;
  credentials?: { accessKeyId: string; secretAccessKey: string };
  forcePathStyle: boolean;
  /** Folders inside the bucket, ending in "/" (validated in lib/env.ts), or "". */
  prefix: string;
};

const isMissing = (e: unknown) => e instanceof S3ServiceException && (e.name === "NotFound" || e.name === "NoSuchKey" || e.$metadata?.httpStatusCode === 404);

/**
 * Files in an S3-compatible bucket, at `<prefix><first two hex digits>/<sha256>` — the same
 * layout as the local folder, so a folder can be copied into a bucket as it is.
 */
export function s3BlobStore(config: S3Config): BlobStore {
  const client = new S3Client({
    region: config.region,
    endpoint: config.endpoint,
    forcePathStyle: config.forcePathStyle,
    credentials: config.credentials,
    // Checksums only where S3 requires them: several S3-compatible servers reject the newer
    // default (CRC32 on every request), and the content hash already names every object.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  const Bucket = config.bucket;
  const keyOf = (sha: string) => config.prefix + contentKey(sha);

  const exists = async (sha: string) => {
    try {
      await client.send(new HeadObjectCommand({ Bucket, Key: keyOf(sha) }));
      return true;
    } catch (e) {
      if (isMissing(e)) return false;
      throw e;
    }
  };

  return {
    kind: "s3",
    exists,
    async put(sha, bytes) {
      if (await exists(sha)) return { created: false };
      // An object appears whole or not at all, so no temporary name is needed. Two instances
      // putting the same hash at once write the same bytes.
      await client.send(new PutObjectCommand({ Bucket, Key: keyOf(sha), Body: bytes, ContentLength: bytes.byteLength, ContentType: "application/octet-stream" }));
      return { created: true };
    },
    async get(sha) {
      try {
        const r = await client.send(new GetObjectCommand({ Bucket, Key: keyOf(sha) }));
        if (!r.Body) return null;
        return Buffer.from(await r.Body.transformToByteArray());
      } catch (e) {
        if (isMissing(e)) return null;
        throw e;
      }
    },
    async delete(sha) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: keyOf(sha) }));
    },
  };
}
