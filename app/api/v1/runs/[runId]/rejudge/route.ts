import { NextResponse } from "next/server";
import { parseId, withApi } from "@/lib/api";
import { rejudgeRun } from "@/db/queries/runs";
import { invalidInput } from "@/lib/errors";
import { rejudgeSchema } from "@/lib/validation/runs";

// An explicit second opinion against a (newer) window; the run's own verdict is kept.
export const POST = withApi<{ runId: string }>(
  async ({ req, db, actor, params }) => {
    const text = await req.text();
    let body: unknown = {};
    if (text.trim()) {
      try {
        body = JSON.parse(text);
      } catch {
        body = null;
      }
    }
    const parsed = rejudgeSchema.safeParse(body ?? {});
    if (!parsed.success || body === null) throw invalidInput(parsed.success ? [{ path: ["_"], message: "not valid JSON" }] : parsed.error.issues);
    const result = await rejudgeRun(db, parseId(params.runId, "That run"), parsed.data.windowId, actor);
    return NextResponse.json(result, { status: 201 });
  },
  { permission: "run.rejudge", what: "re-judge runs" },
);
