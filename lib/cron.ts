import "server-only";
import { NextResponse } from "next/server";
import { getDb } from "@/db";
import type { Db } from "@/db/client";
import { errorResponse } from "./api";
import { AppError } from "./errors";
import { env } from "./env";
import { safeEqual } from "./secrets";

/**
 * The wrapper for cron routes. There is no user here: an external scheduler proves itself with
 * `Authorization: Bearer <CRON_SECRET>`, compared in constant time. Without CRON_SECRET set, the
 * route refuses everyone (the in-process timer still ticks).
 */
export function withCronSecret(handler: (ctx: { db: Db; now: Date }) => Promise<unknown>) {
  const route = async (req: Request) => {
    const secret = env().CRON_SECRET;
    const m = /^Bearer\s+(\S+)$/i.exec(req.headers.get("authorization") ?? "");
    if (!secret || !m || !safeEqual(m[1], secret)) {
      return errorResponse(new AppError("unauthorized", "Send the scheduler's secret as Authorization: Bearer <CRON_SECRET>."));
    }
    try {
      return NextResponse.json(await handler({ db: await getDb(), now: new Date() }));
    } catch (err) {
      console.error("[cron] tick failed", err);
      return errorResponse(new AppError("internal", "The tick failed. It has been logged; the next one will pick up where it stopped."));
    }
  };
  Object.assign(route, { permission: "cron-secret" });
  return route;
}
