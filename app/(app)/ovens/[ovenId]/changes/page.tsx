import { EmptyState } from "@/components/ui/empty-state";
import { loadOvenForPage } from "@/db/queries/oven-page";

export const metadata = { title: "Changes" };

export default async function OvenChanges({ params }: { params: Promise<{ ovenId: string }> }) {
  const { oven } = await loadOvenForPage((await params).ovenId);
  return (
    <EmptyState title="No changes logged">
      Hardware and firmware changes to {oven.tag} — fans, baffles, heaters, controller firmware — are logged here with what they were
      before and after, so their effect can be proved from the runs on either side.
    </EmptyState>
  );
}
