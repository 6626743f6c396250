import { loadOvenForPage } from "@/db/queries/oven-page";
import { computeOvenHealth } from "@/db/queries/health";
import { getDb } from "@/db";
import { HealthBadge } from "@/components/oven/health-badge";
import { SafetyNote } from "@/components/oven/safety-note";
import { requirePermission } from "@/lib/session";
import { HealthCharts } from "./health-charts";
import { DriftControls } from "./drift-controls";
import { driftParams } from "@/db/queries/drift";
import { can } from "@/lib/permissions";

export const metadata = { title: "Health" };

export default async function OvenHealth({ params }: { params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("fleet.read");
  const { oven } = await loadOvenForPage((await params).ovenId);
  const now = new Date();
  const db = await getDb();
  const [health, settings] = await Promise.all([computeOvenHealth(db, oven.id, now), driftParams(db, oven.id)]);
  return (
    <div className="space-y-4">
      <section aria-labelledby="health-heading" className="card p-4">
        <h2 id="health-heading" className="flex flex-wrap items-center gap-2 font-semibold">
          Health <HealthBadge state={health.state} />
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
          {health.reasons.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      </section>
      {can(actor.role, "baseline.manage") ? <DriftControls ovenId={oven.id} params={settings} /> : null}
      <HealthCharts ovenId={oven.id} now={now.getTime()} params={settings} />
      <SafetyNote kind="verdicts" />
    </div>
  );
}
