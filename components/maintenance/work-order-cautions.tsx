import { SafetyNote } from "@/components/oven/safety-note";

/** Lock-out/tag-out on every plan or order that involves heaters, wiring or the chamber. */
export function WorkOrderCautions({ lockout, title }: { lockout: boolean; title: string }) {
  const fumes = /flux|exhaust|trap|filter|clean/i.test(title);
  const nitrogen = /nitrogen|O₂|oxygen/i.test(title);
  if (!lockout && !fumes && !nitrogen) return null;
  return (
    <div className="space-y-2">
      {lockout ? <SafetyNote kind="lockout" /> : null}
      {fumes ? <SafetyNote kind="fumes" /> : null}
      {nitrogen ? <SafetyNote kind="nitrogen" /> : null}
    </div>
  );
}
