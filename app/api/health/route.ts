import { NextResponse } from "next/server";
import { sql } from "drizzle-orm";
import { getDb } from "@/db";

export const dynamic = "force-dynamic";

// Public on purpose: load balancers and the demo script poll it. It reveals nothing but "up".
export async function GET() {
  try {
    const db = await getDb();
    await db.run(sql`select 1`);
    return NextResponse.json({ status: "ok" });
  } catch (err) {
    console.error("[health]", err);
    return NextResponse.json({ status: "unavailable" }, { status: 503 });
  }
}
