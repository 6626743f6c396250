import { NextResponse } from "next/server";
import { parseId, readFileUpload, withApi } from "@/lib/api";
import { addChangeAttachment } from "@/db/queries/changes";
import { MAX_UPLOAD_BYTES } from "@/lib/uploads/file-type";

/** multipart/form-data with one `file`: a JPEG, PNG or WebP photo or a PDF, at most 10 MB. */
export const POST = withApi<{ changeId: string }>(
  async ({ req, db, actor, params }) => {
    const { file } = await readFileUpload(req, { maxBytes: MAX_UPLOAD_BYTES, label: "photo or document" });
    const saved = await addChangeAttachment(db, parseId(params.changeId, "That change"), file, actor);
    return NextResponse.json(saved, { status: 201 });
  },
  { permission: "change.create", what: "attach files to changes" },
);
