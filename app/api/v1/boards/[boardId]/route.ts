import { parseId, readJson, withApi } from "@/lib/api";
import { boardJson, getBoard, updateBoard } from "@/db/queries/boards";
import { notFound } from "@/lib/errors";
import { boardUpdateSchema } from "@/lib/validation/windows";

export const GET = withApi<{ boardId: string }>(
  async ({ db, params }) => {
    const b = await getBoard(db, parseId(params.boardId, "That test board"));
    if (!b) throw notFound("That test board");
    return boardJson(b);
  },
  { permission: "run.read", what: "see test boards" },
);

export const PATCH = withApi<{ boardId: string }>(
  async ({ req, db, actor, params }) => boardJson(await updateBoard(db, parseId(params.boardId, "That test board"), await readJson(req, boardUpdateSchema), actor)),
  { permission: "board.manage", what: "edit test boards" },
);
