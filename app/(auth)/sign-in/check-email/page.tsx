import Link from "next/link";

export const metadata = { title: "Check your e-mail" };

export default function CheckEmail() {
  return (
    <div className="card space-y-3 p-6">
      <h1 className="text-xl font-semibold">Check your e-mail</h1>
      <p className="text-sm text-ink-muted">
        If that address belongs to an Ovenward account, a sign-in link is on its way. It works once and expires in 24 hours.
      </p>
      <Link href="/sign-in" className="text-sm font-medium text-ember-strong underline">
        Back to sign-in
      </Link>
    </div>
  );
}
