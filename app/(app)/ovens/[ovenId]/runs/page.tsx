import { EmptyState } from "@/components/ui/empty-state";
import { loadOvenForPage } from "@/db/queries/oven-page";

export const metadata = { title: "Runs" };

export default async function OvenRuns({ params }: { params: Promise<{ ovenId: string }> }) {
  const { oven } = await loadOvenForPage((await params).ovenId);
  return (
    <EmptyState title="No verification runs yet">
      Each run of a test board through {oven.tag} — its logger file, probe curves, metrics and verdict against the process window —
      will be listed here, newest first.
    </EmptyState>
  );
}
