import { withApi } from "@/lib/api";
import { ROLE_PERMISSIONS } from "@/lib/permissions";

export const GET = withApi(
  async ({ actor }) => ({
    id: actor.userId,
    email: actor.email,
    name: actor.name,
    role: actor.role,
    via: actor.kind,
    permissions: ROLE_PERMISSIONS[actor.role],
  }),
  { permission: null },
);
export type MeResponse = { id: string; email: string; name: string | null; role: string; via: "session" | "token"; permissions: string[] };
