import { EmptyState } from "@/components/ui/empty-state";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { SafetyNote } from "@/components/oven/safety-note";

export const metadata = { title: "Maintenance" };

export default async function OvenMaintenance({ params }: { params: Promise<{ ovenId: string }> }) {
  const { oven } = await loadOvenForPage((await params).ovenId);
  return (
    <div className="space-y-4">
      <SafetyNote kind="lockout" />
      <EmptyState title="No plans or work orders yet">
        Preventive plans for {oven.tag} (flux and exhaust cleaning, conveyor lubrication, blower checks, calibration) and their work
        orders will appear here.
      </EmptyState>
    </div>
  );
}
