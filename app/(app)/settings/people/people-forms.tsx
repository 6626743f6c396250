"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { ROLE_LABELS } from "@/lib/permissions";
import { ROLES, type Role } from "@/db/schema/users";
import { inviteUserAction, updateUserAccessAction } from "../actions";

export function InviteForm() {
  return (
    <ActionForm action={inviteUserAction} className="card grid gap-3 p-5 sm:grid-cols-[1fr_1fr_12rem_auto] sm:items-end">
      {({ fields, pending }) => (
        <>
          <TextField label="E-mail" name="email" type="email" error={fields?.email} />
          <TextField label="Name" name="name" error={fields?.name} />
          <SelectField label="Role" name="role" defaultValue="technician" error={fields?.role}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </SelectField>
          <Button variant="primary" type="submit" disabled={pending}>
            Send invitation
          </Button>
        </>
      )}
    </ActionForm>
  );
}

export function AccessForm({ userId, role, active, email }: { userId: string; role: Role; active: boolean; email: string }) {
  return (
    <div className="flex flex-wrap items-center gap-2">
      <ActionForm action={updateUserAccessAction} className="flex flex-wrap items-center gap-2">
        {({ pending }) => (
          <>
            <input type="hidden" name="userId" value={userId} />
            <label className="sr-only" htmlFor={`role-${userId}`}>
              Role of {email}
            </label>
            <select id={`role-${userId}`} name="role" defaultValue={role} className="min-h-11 rounded-lg border border-paper-line bg-paper-raised px-2 text-sm">
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
            <Button type="submit" disabled={pending}>
              Save role
            </Button>
          </>
        )}
      </ActionForm>
      <ActionForm action={updateUserAccessAction}>
        {({ pending }) => (
          <>
            <input type="hidden" name="userId" value={userId} />
            <input type="hidden" name="active" value={active ? "false" : "true"} />
            <Button type="submit" variant={active ? "danger" : "secondary"} disabled={pending}>
              {active ? "Deactivate" : "Reactivate"}
            </Button>
          </>
        )}
      </ActionForm>
    </div>
  );
}
