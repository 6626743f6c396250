import { NextResponse } from "next/server";
import { parseId, withApi } from "@/lib/api";
import { addAttachment } from "@/db/queries/work-order-extras";
import { AppError } from "@/lib/errors";

type Params = { workOrderId: string };

/** multipart/form-data with one `file`: a JPEG, PNG or WebP photo or a PDF, at most 10 MB. */
export const POST = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const id = parseId(params.workOrderId, "That work order");
    const form = await req.formData().catch(() => null);
    const file = form?.get("file");
    if (!file || typeof file === "string") throw new AppError("invalid_input", "file: is required (multipart form field \"file\").", { fields: { file: "is required" } });
    const saved = await addAttachment(db, id, { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) }, actor);
    return NextResponse.json(saved, { status: 201 });
  },
  { permission: "workorder.update", what: "attach files to work orders" },
);
