import { getDb } from "@/db";
import { findInvite } from "@/db/queries/users";
import { SetPasswordForm } from "./set-password-form";

export const metadata = { title: "Choose a password" };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invite = await findInvite(await getDb(), token);
  return (
    <div className="card space-y-4 p-6">
      <h1 className="text-xl font-semibold">Choose a password</h1>
      {invite ? (
        <>
          <p className="text-sm text-ink-muted">
            Welcome, {invite.user.name ?? invite.user.email}. Choose a password for your Ovenward account.
          </p>
          <SetPasswordForm token={token} />
        </>
      ) : (
        <p className="text-sm text-ink-muted">This invitation link has expired or was already used. Ask your admin for a new one.</p>
      )}
    </div>
  );
}
