import { getDb } from "@/db";
import { listOvens } from "@/db/queries/ovens";
import { PageHeader } from "@/components/ui/page-header";
import { SafetyNote } from "@/components/oven/safety-note";
import { requirePermission } from "@/lib/session";
import { PlanForm } from "./plan-form";

export const metadata = { title: "New plan" };

export default async function NewPlanPage() {
  await requirePermission("plan.manage");
  const ovens = (await listOvens(await getDb())).filter((r) => r.oven.serviceState !== "retired");
  return (
    <div className="max-w-3xl">
      <PageHeader title="New plan" subtitle="One copy of the plan is made for each oven you pick; each can be changed on its own later." />
      <PlanForm ovens={ovens.map((r) => ({ id: r.oven.id, tag: r.oven.tag, timeZone: r.site.timeZone }))} />
      <div className="mt-4"><SafetyNote kind="lockout" /></div>
    </div>
  );
}
