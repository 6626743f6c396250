import type { Role } from "@/db/schema/users";

/** Who is making a request: a signed-in person or an API token acting for one. */
export type Actor = {
  kind: "session" | "token";
  userId: string;
  tokenId: number | null;
  email: string;
  name: string | null;
  role: Role;
};
