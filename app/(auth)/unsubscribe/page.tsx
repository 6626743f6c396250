import Link from "next/link";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db";
import { subscriptions } from "@/db/schema/mail";
import { readUnsubscribeToken } from "@/lib/unsubscribe";
import { AppError } from "@/lib/errors";
import { MAIL_KIND_INFO } from "@/lib/mail/kinds";
import { buttonClass } from "@/components/ui/button";

export const metadata = { title: "Stop an e-mail" };
export const dynamic = "force-dynamic";

// Public: the signed token in the link is the only credential. Opening the page changes
// nothing (mail scanners open links); the button, or a client's one-click POST, does.
export default async function UnsubscribePage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const db = await getDb();
  let found: Awaited<ReturnType<typeof readUnsubscribeToken>> | null = null;
  let problem = "This link has no token. Copy the whole link from the e-mail.";
  if (token) {
    try {
      found = await readUnsubscribeToken(db, token);
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      problem = err.message;
    }
  }
  if (!found || !token) {
    return (
      <div className="card space-y-3 p-6" role="alert">
        <h1 className="text-xl font-semibold">This link does not work</h1>
        <p className="text-sm text-ink-muted">{problem}</p>
        <Link href="/settings/notifications" className="text-sm font-medium text-ember-strong underline">
          Open your e-mail settings
        </Link>
      </div>
    );
  }
  const label = MAIL_KIND_INFO[found.kind].label;
  const [sub] = await db.select().from(subscriptions).where(and(eq(subscriptions.userId, found.user.id), eq(subscriptions.kind, found.kind))).limit(1);
  const stopped = sub ? !sub.enabled : false;
  return (
    <div className="card space-y-4 p-6">
      {stopped ? (
        <>
          <h1 className="text-xl font-semibold">Done — no more “{label}”</h1>
          <p className="text-sm text-ink-muted" role="status">
            {found.user.email} will not get this e-mail any more. Other e-mails you chose are not affected.
          </p>
        </>
      ) : (
        <>
          <h1 className="text-xl font-semibold">Stop “{label}”?</h1>
          <p className="text-sm text-ink-muted">
            {found.user.email} gets this e-mail: {MAIL_KIND_INFO[found.kind].about.toLowerCase()} Press the button and it stops; nothing else changes.
          </p>
          <form method="post" action={`/unsubscribe?token=${encodeURIComponent(token)}`}>
            <input type="hidden" name="from" value="page" />
            <button type="submit" className={buttonClass("primary")}>
              Stop this e-mail
            </button>
          </form>
        </>
      )}
      <p className="text-sm">
        <Link href="/settings/notifications" className="font-medium text-ember-strong underline">
          Choose what you receive
        </Link>{" "}
        <span className="text-ink-muted">(sign-in needed)</span>
      </p>
    </div>
  );
}
