import "server-only";
import { cache } from "react";
import { notFound } from "next/navigation";
import { getDb } from "@/db";
import { getOven } from "@/db/queries/ovens";
import { getWorkOrder, listParts } from "@/db/queries/work-orders";
import { listAttachments, listComments } from "@/db/queries/work-order-extras";

/** The work order behind a /work-orders/[id] page, with its oven and everything attached. */
export const loadWorkOrderPage = cache(async (rawId: string) => {
  const id = Number(rawId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const db = await getDb();
  const order = await getWorkOrder(db, id);
  if (!order) notFound();
  const [oven, parts, attachments, comments] = await Promise.all([getOven(db, order.ovenId), listParts(db, id), listAttachments(db, id), listComments(db, id)]);
  return { order, oven: oven!, parts, attachments, comments };
});
