import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { createWindowAction } from "../actions";
import { WindowForm } from "../window-form";

export const metadata = { title: "New process window" };

export default async function NewWindowPage() {
  await requirePermission("window.manage");
  return (
    <>
      <PageHeader title="New process window" subtitle="Start from a preset, then set the limits your paste and components need." />
      <WindowForm action={createWindowAction} />
    </>
  );
}
