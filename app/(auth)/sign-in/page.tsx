import { redirect } from "next/navigation";
import { getSessionActor } from "@/lib/session";
import { env } from "@/lib/env";
import { DEMO_USERS } from "@/db/seed/demo-plant";
import { MagicLinkForm, PasswordForm } from "./sign-in-forms";

export const metadata = { title: "Sign in" };

const ERRORS: Record<string, string> = {
  Verification: "That sign-in link has expired or was already used. Ask for a new one below.",
  AccessDenied: "That account cannot sign in. Ask an admin to check it.",
  Configuration: "Sign-in is not configured correctly on this server. Tell your admin.",
};

// A direct POST to the sign-in library's endpoints comes back here with ?error=…&code=….
const CODES: Record<string, string> = {
  rate_limited: "Too many sign-in attempts from your network. Wait a few minutes and try again, or ask an admin to help.",
  locked: "Too many failed sign-ins for this account. It is locked for a while; try again later, or ask an admin to help.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; error?: string; code?: string }> }) {
  const { next, error, code } = await searchParams;
  if (await getSessionActor()) redirect(next && next.startsWith("/") && !next.startsWith("//") ? next : "/fleet");
  const demo = env().DEMO_MODE === "on";
  return (
    <>
      <div className="card space-y-5 p-6">
        <div>
          <h1 className="text-2xl font-semibold">Sign in</h1>
          <p className="mt-1 text-sm text-ink-muted">Ovenward keeps your plant&apos;s reflow ovens measured, maintained and in window.</p>
        </div>
        {error ? (
          <p role="alert" className="rounded-lg border border-health-act/40 bg-red-50 px-3 py-2 text-sm text-health-act">
            {(code && CODES[code]) ?? ERRORS[error] ?? "Sign-in did not complete. Try again."}
          </p>
        ) : null}
        <PasswordForm next={next} />
        <div className="flex items-center gap-3 text-xs text-ink-muted" aria-hidden="true">
          <span className="h-px flex-1 bg-paper-line" /> or <span className="h-px flex-1 bg-paper-line" />
        </div>
        <MagicLinkForm next={next} />
      </div>
      {demo ? (
        <section aria-labelledby="demo-heading" className="card border-dashed p-4 text-sm">
          <h2 id="demo-heading" className="font-semibold">
            Demo sign-ins
          </h2>
          <p className="mt-1 text-ink-muted">
            Every demo account uses the password <code className="num rounded bg-paper-sunk px-1">{env().DEMO_PASSWORD}</code>.
          </p>
          <ul className="mt-2 space-y-1">
            {DEMO_USERS.map((u) => (
              <li key={u.email} className="flex justify-between gap-2">
                <code>{u.email}</code>
                <span className="text-ink-muted">{u.role}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}
