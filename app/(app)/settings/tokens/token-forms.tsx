"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { ROLE_LABELS } from "@/lib/permissions";
import { ROLES } from "@/db/schema/users";
import { createTokenAction, revokeTokenAction } from "../actions";

export function CreateTokenForm({ users }: { users: { id: string; email: string }[] }) {
  return (
    <ActionForm
      action={createTokenAction}
      className="card grid gap-3 p-5 sm:grid-cols-[1fr_1fr_12rem_auto] sm:items-end"
      render={(r) =>
        r.ok ? (
          <div className="sm:col-span-4 rounded-lg border border-health-steady/40 bg-teal-50 p-3 text-sm" role="status">
            <p className="font-semibold">Copy this token now. It is shown once and never again.</p>
            <code data-testid="new-token" className="mt-1 block break-all rounded bg-white p-2 text-base">
              {(r.data as { secret: string }).secret}
            </code>
          </div>
        ) : null
      }
    >
      {({ fields, pending }) => (
        <>
          <SelectField label="Acts for" name="userId" error={fields?.userId}>
            {users.map((u) => (
              <option key={u.id} value={u.id}>
                {u.email}
              </option>
            ))}
          </SelectField>
          <TextField label="Label" name="name" placeholder="e.g. Line 2 logger" error={fields?.name} />
          <SelectField label="Role (at most the user's)" name="role" defaultValue="" error={fields?.role}>
            <option value="">Same as the user</option>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </SelectField>
          <Button variant="primary" type="submit" disabled={pending}>
            Create token
          </Button>
        </>
      )}
    </ActionForm>
  );
}

export function RevokeTokenForm({ tokenId, label }: { tokenId: number; label: string }) {
  return (
    <ActionForm action={revokeTokenAction}>
      {({ pending }) => (
        <>
          <input type="hidden" name="tokenId" value={tokenId} />
          <Button type="submit" variant="danger" disabled={pending} aria-label={`Revoke ${label}`}>
            Revoke
          </Button>
        </>
      )}
    </ActionForm>
  );
}
