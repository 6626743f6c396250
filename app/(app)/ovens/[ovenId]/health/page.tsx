import { EmptyState } from "@/components/ui/empty-state";
import { loadOvenForPage } from "@/db/queries/oven-page";

export const metadata = { title: "Health" };

export default async function OvenHealth({ params }: { params: Promise<{ ovenId: string }> }) {
  const { oven } = await loadOvenForPage((await params).ovenId);
  return (
    <EmptyState title="No trend yet">
      Health shows how {oven.tag}&apos;s ΔT, critical-phase spread, heat-up rate, coldest peak, shortest time above liquidus and time to
      peak move across months, with every change and completed work order marked. It fills in once verification runs are recorded.
    </EmptyState>
  );
}
