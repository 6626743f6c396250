import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function NotFound() {
  return (
    <div className="card max-w-xl space-y-3 p-6">
      <h1 className="text-xl font-semibold">Not found</h1>
      <p className="text-sm text-ink-muted">There is nothing at this address. It may have been moved, or the link may be mistyped.</p>
      <Link href="/fleet" className={buttonClass("primary")}>
        Go to the fleet
      </Link>
    </div>
  );
}
