import { parseId, readJson, withApi } from "@/lib/api";
import { getWindow, listWindowVersions, updateWindow, windowJson } from "@/db/queries/windows";
import { notFound } from "@/lib/errors";
import { windowUpdateSchema } from "@/lib/validation/windows";

export const GET = withApi<{ windowId: string }>(
  async ({ db, params }) => {
    const id = parseId(params.windowId, "That process window");
    const w = await getWindow(db, id);
    if (!w) throw notFound("That process window");
    const versions = await listWindowVersions(db, id);
    return { ...windowJson(w), versions: versions.map((v) => ({ version: v.version, values: v.values, createdAt: v.createdAt.toISOString() })) };
  },
  { permission: "run.read", what: "see process windows" },
);

export const PATCH = withApi<{ windowId: string }>(
  async ({ req, db, actor, params }) => windowJson(await updateWindow(db, parseId(params.windowId, "That process window"), await readJson(req, windowUpdateSchema), actor)),
  { permission: "window.manage", what: "edit process windows" },
);
