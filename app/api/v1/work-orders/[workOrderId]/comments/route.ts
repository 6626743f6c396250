import { NextResponse } from "next/server";
import { parseId, readJson, withApi } from "@/lib/api";
import { addComment } from "@/db/queries/work-order-extras";
import { commentSchema } from "@/lib/validation/maintenance";

type Params = { workOrderId: string };

/** `{ body }`; @mentions in the body are resolved to user ids. */
export const POST = withApi<Params>(
  async ({ req, db, actor, params }) => {
    const { body } = await readJson(req, commentSchema);
    return NextResponse.json(await addComment(db, parseId(params.workOrderId, "That work order"), body, actor), { status: 201 });
  },
  { permission: "workorder.update", what: "comment on work orders" },
);
