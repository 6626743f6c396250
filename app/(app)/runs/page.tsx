import { getDb } from "@/db";
import { listRuns, runListItemJson } from "@/db/queries/run-list";
import { runChoices } from "@/db/queries/run-options";
import { listSitesWithLines } from "@/db/queries/sites";
import { RunsTable } from "@/components/runs/runs-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { runListQuerySchema } from "@/lib/validation/runs";

export const metadata = { title: "Runs" };

export default async function FleetRuns() {
  await requirePermission("run.read");
  const db = await getDb();
  const [first, choices, sites] = await Promise.all([listRuns(db, runListQuerySchema.parse({})), runChoices(db), listSitesWithLines(db)]);
  return (
    <>
      <PageHeader title="Verification runs" subtitle="Every oven's runs, newest first. Filter, sort, and export what you see as CSV." />
      <RunsTable timeZone={sites[0]?.timeZone ?? "UTC"} ovens={choices.ovens} windows={choices.windows} instruments={choices.instruments} initial={{ items: first.items.map(runListItemJson), total: first.total }} />
    </>
  );
}
