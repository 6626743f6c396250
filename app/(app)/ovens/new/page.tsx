import { getDb } from "@/db";
import { listSitesWithLines } from "@/db/queries/sites";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { OvenForm } from "@/components/oven/oven-form";
import { requirePermission } from "@/lib/session";
import { createOvenAction } from "../actions";

export const metadata = { title: "Add an oven" };

export default async function NewOvenPage() {
  await requirePermission("oven.create");
  const sites = await listSitesWithLines(await getDb());
  const lines = sites.flatMap((s) => s.lines.map((l) => ({ id: l.id, label: `${l.name} · ${s.name}` })));
  return (
    <>
      <PageHeader title="Add an oven" subtitle="Its runs, changes and maintenance will collect on its page." />
      {lines.length ? (
        <OvenForm action={createOvenAction} lines={lines} canRetire={false} />
      ) : (
        <EmptyState title="No lines yet">An admin first adds a site and its lines (Administration → Sites and lines).</EmptyState>
      )}
    </>
  );
}
