import { NextResponse } from "next/server";
import { readJson, withApi } from "@/lib/api";
import { boardJson, createBoard, listBoards } from "@/db/queries/boards";
import { boardCreateSchema } from "@/lib/validation/windows";

export const GET = withApi(async ({ db }) => ({ items: (await listBoards(db)).map(boardJson) }), { permission: "run.read", what: "see test boards" });

export const POST = withApi(
  async ({ req, db, actor }) => NextResponse.json(boardJson(await createBoard(db, await readJson(req, boardCreateSchema), actor)), { status: 201 }),
  { permission: "board.manage", what: "edit test boards" },
);
