import { defineAction } from "@/lib/action";
import type { Actor } from "@/lib/actor";
import { forbidden } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { saveSubscription, setUserTimeZone } from "@/db/queries/subscriptions";
import { resendOutbox } from "@/db/queries/outbox";
import { outboxResendSchema, subscriptionFormSchema, timeZoneSchema } from "@/lib/validation/mail";

/** Everyone sets their own e-mails; changing someone else's needs subscription.manage.team. */
function checkWhose(actor: Actor, userId: string) {
  if (userId !== actor.userId && !can(actor.role, "subscription.manage.team")) throw forbidden("change other people's e-mails");
}

export const updateSubscriptionDef = defineAction({
  name: "updateSubscription",
  permission: "subscription.manage.own",
  schema: subscriptionFormSchema,
  run: async ({ db, actor, input }) => {
    checkWhose(actor, input.userId);
    const scheduled = input.kind === "fleet_digest" || input.kind === "my_work_daily";
    const row = await saveSubscription(db, { ...input, weekdays: scheduled ? input.weekdays : undefined, sendAt: scheduled ? input.sendAt : undefined }, actor);
    return { id: row.id, kind: row.kind, enabled: row.enabled, schedule: row.schedule };
  },
});

export const updateMailTimeZoneDef = defineAction({
  name: "updateMailTimeZone",
  permission: "subscription.manage.own",
  schema: timeZoneSchema,
  run: async ({ db, actor, input }) => {
    checkWhose(actor, input.userId);
    await setUserTimeZone(db, input.userId, input.timeZone, actor);
    return { timeZone: input.timeZone };
  },
});

export const resendOutboxDef = defineAction({
  name: "resendOutboxMessage",
  permission: "outbox.manage",
  schema: outboxResendSchema,
  run: async ({ db, actor, input }) => {
    const row = await resendOutbox(db, input.outboxId, actor);
    return { id: row.id, state: row.state };
  },
});
