import { NextResponse } from "next/server";
import { parseId, readFileUpload, withApi } from "@/lib/api";
import { addAttachment } from "@/db/queries/work-order-extras";
import { MAX_UPLOAD_BYTES } from "@/lib/uploads/file-type";

type Params = { workOrderId: string };

/** multipart/form-data with one `file`: a JPEG, PNG or WebP photo or a PDF, at most 10 MB. */
export const POST = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const id = parseId(params.workOrderId, "That work order");
    // Through readFileUpload like the other uploads: a body declaring more than the limit is
    // refused before it is read into memory.
    const { file } = await readFileUpload(req, { maxBytes: MAX_UPLOAD_BYTES, label: "photo or document" });
    const saved = await addAttachment(db, id, { name: file.name, bytes: file.bytes }, actor);
    return NextResponse.json(saved, { status: 201 });
  },
  { permission: "workorder.update", what: "attach files to work orders" },
);
