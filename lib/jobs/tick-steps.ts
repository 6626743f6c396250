import type { Db } from "@/db/client";

/*
 * Work the scheduler runs on each tick before the mail is enqueued, e.g. generating due
 * maintenance work orders. A step pushes itself here from its own module; each returns how many
 * things it generated. Steps must be idempotent: a tick may be retried after a crash.
 */
export type TickStep = { name: string; run: (ctx: { db: Db; now: Date }) => Promise<number> };

export const TICK_STEPS: TickStep[] = [];
