import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { requireUser } from "@/lib/session";
import { ROLE_LABELS } from "@/lib/permissions";

export const metadata = { title: "No access" };

export default async function NoAccess({ searchParams }: { searchParams: Promise<{ need?: string }> }) {
  const actor = await requireUser();
  const { need } = await searchParams;
  return (
    <div className="card max-w-xl space-y-3 p-6">
      <h1 className="text-xl font-semibold">Your role cannot open that page</h1>
      <p className="text-sm text-ink-muted">
        You are signed in as a {ROLE_LABELS[actor.role].toLowerCase()}
        {need ? (
          <>
            , and that page needs the <code>{need}</code> permission
          </>
        ) : null}
        . Ask an admin if you need it.
      </p>
      <Link href="/fleet" className={buttonClass("primary")}>
        Go to the fleet
      </Link>
    </div>
  );
}
