import { eq } from "drizzle-orm";
import { parseId, withApi } from "@/lib/api";
import { calibrations } from "@/db/schema/instruments";
import { storedFiles } from "@/db/schema/files";
import { notFound } from "@/lib/errors";
import { blobStore } from "@/lib/storage/blob-store";

export const GET = withApi<{ calibrationId: string }>(
  async ({ db, params }) => {
    const id = parseId(params.calibrationId, "That calibration");
    const [row] = await db.select({ file: storedFiles }).from(calibrations).innerJoin(storedFiles, eq(storedFiles.sha256, calibrations.certificateSha256)).where(eq(calibrations.id, id)).limit(1);
    const bytes = row ? await blobStore().get(row.file.sha256) : null;
    if (!row || !bytes) throw notFound("The certificate of that calibration");
    const ext = row.file.mediaType === "application/pdf" ? "pdf" : row.file.mediaType === "image/png" ? "png" : "jpg";
    return new Response(new Uint8Array(bytes), {
      headers: { "content-type": row.file.mediaType, "content-disposition": `attachment; filename="calibration-${id}.${ext}"`, "x-content-type-options": "nosniff" },
    });
  },
  { permission: "run.read", what: "download certificates" },
);
