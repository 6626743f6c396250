import { NextResponse } from "next/server";
import { readJson, withApi } from "@/lib/api";
import { createWindow, listWindows, windowJson } from "@/db/queries/windows";
import { windowCreateSchema } from "@/lib/validation/windows";

export const GET = withApi(async ({ db }) => ({ items: (await listWindows(db)).map(windowJson) }), { permission: "run.read", what: "see process windows" });

export const POST = withApi(
  async ({ req, db, actor }) => NextResponse.json(windowJson(await createWindow(db, await readJson(req, windowCreateSchema), actor)), { status: 201 }),
  { permission: "window.manage", what: "edit process windows" },
);
