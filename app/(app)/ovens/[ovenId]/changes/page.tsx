import { EmptyState } from "@/components/ui/empty-state";
import { ChangeList } from "@/components/oven/change-list";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { attachmentsFor, listChanges } from "@/db/queries/changes";
import { getDb } from "@/db";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { ChangeForm } from "./change-form";

export const metadata = { title: "Changes" };

export default async function OvenChanges({ params }: { params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("change.read");
  const { oven, site } = await loadOvenForPage((await params).ovenId);
  const db = await getDb();
  const rows = await listChanges(db, { ovenId: oven.id });
  const files = await attachmentsFor(db, rows.map((r) => r.change.id));
  return (
    <div className="space-y-6">
      {can(actor.role, "change.create") ? (
        <section aria-labelledby="log-heading">
          <h2 id="log-heading" className="mb-2 font-semibold">
            Log a change
          </h2>
          <ChangeForm ovenId={oven.id} />
        </section>
      ) : null}
      <section aria-labelledby="history-heading">
        <h2 id="history-heading" className="mb-2 font-semibold">
          Modification log
        </h2>
        {rows.length ? (
          <ChangeList rows={rows} attachments={files} timeZone={site.timeZone} />
        ) : (
          <EmptyState title="No changes logged">
            Hardware and firmware changes to {oven.tag} — fans, baffles, heaters, controller firmware — are logged here with what they
            were before and after, so their effect can be proved from the runs on either side.
          </EmptyState>
        )}
      </section>
    </div>
  );
}
