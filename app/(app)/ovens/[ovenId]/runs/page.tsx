import Link from "next/link";
import { getDb } from "@/db";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { listRuns, runListItemJson } from "@/db/queries/run-list";
import { runChoices } from "@/db/queries/run-options";
import { RunsTable } from "@/components/runs/runs-table";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { runListQuerySchema } from "@/lib/validation/runs";

export const metadata = { title: "Runs" };

export default async function OvenRuns({ params }: { params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("run.read");
  const { oven, site } = await loadOvenForPage((await params).ovenId);
  const db = await getDb();
  const [first, choices] = await Promise.all([listRuns(db, runListQuerySchema.parse({ ovenId: String(oven.id) })), runChoices(db)]);
  const upload = can(actor.role, "run.create") ? (
    <Link href={`/ovens/${oven.id}/runs/new`} className={buttonClass("primary")}>Record a run</Link>
  ) : null;
  if (first.total === 0) {
    return (
      <EmptyState title="No verification runs yet" action={upload}>
        Each run of a test board through {oven.tag} — its logger file, probe curves, metrics and verdict against the process window — will be listed here, newest first.
      </EmptyState>
    );
  }
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm text-ink-muted">Verification runs of {oven.tag}, newest first. Sort by a column; filter by date, verdict, window or instrument.</p>
        {upload}
      </div>
      <RunsTable timeZone={site.timeZone} ovenId={oven.id} windows={choices.windows} instruments={choices.instruments} initial={{ items: first.items.map(runListItemJson), total: first.total }} />
    </div>
  );
}
