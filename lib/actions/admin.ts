import { createElement } from "react";
import { defineAction } from "@/lib/action";
import { inviteUser, updateUserAccess, withdrawInvite } from "@/db/queries/users";
import { AppError } from "@/lib/errors";
import { createApiToken, revokeApiToken } from "@/db/queries/api-tokens";
import { createLine, createSite } from "@/db/queries/sites";
import { inviteSchema, tokenCreateSchema, tokenRevokeSchema, userAccessSchema } from "@/lib/validation/user";
import { lineCreateSchema, siteCreateSchema } from "@/lib/validation/site";
import { sendMail } from "@/lib/mail";
import { appUrl } from "@/lib/env";
import { InvitationEmail } from "@/emails/invitation";

export const inviteUserDef = defineAction({
  name: "inviteUser",
  permission: "user.manage",
  schema: inviteSchema,
  run: async ({ db, actor, input }) => {
    const { user, secret } = await inviteUser(db, input, actor);
    const url = `${appUrl()}/invite/${secret}`;
    try {
      await sendMail({
        to: user.email,
        subject: "You have an Ovenward account",
        element: createElement(InvitationEmail, { url, invitedBy: actor.name ?? actor.email, role: user.role, plant: "your plant" }),
      });
    } catch (err) {
      // An account nobody was told about would block a second try ("already has an account").
      const reason = (err as Error).message.slice(0, 200);
      await withdrawInvite(db, user.id, reason, actor);
      throw new AppError("unavailable", `The invitation to ${user.email} could not be e-mailed (${reason}), so no account was made. Check the mail settings (SMTP_URL) and invite again.`);
    }
    return { id: user.id, email: user.email };
  },
});

export const updateUserAccessDef = defineAction({
  name: "updateUserAccess",
  permission: "user.manage",
  schema: userAccessSchema,
  run: async ({ db, actor, input }) => {
    const row = await updateUserAccess(db, input.userId, { role: input.role, active: input.active }, actor);
    return { id: row.id };
  },
});

export const createTokenDef = defineAction({
  name: "createApiToken",
  permission: "token.manage",
  schema: tokenCreateSchema,
  run: async ({ db, actor, input }) => {
    const { token, secret } = await createApiToken(db, input, actor);
    return { id: token.id, secret, name: token.name };
  },
});

export const revokeTokenDef = defineAction({
  name: "revokeApiToken",
  permission: "token.manage",
  schema: tokenRevokeSchema,
  run: async ({ db, actor, input }) => {
    await revokeApiToken(db, input.tokenId, actor);
    return { id: input.tokenId };
  },
});

export const createSiteDef = defineAction({
  name: "createSite",
  permission: "site.manage",
  schema: siteCreateSchema,
  run: async ({ db, actor, input }) => ({ id: (await createSite(db, input, actor)).id }),
});

export const createLineDef = defineAction({
  name: "createLine",
  permission: "site.manage",
  schema: lineCreateSchema,
  run: async ({ db, actor, input }) => ({ id: (await createLine(db, input, actor)).id }),
});
