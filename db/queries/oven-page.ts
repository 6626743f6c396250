import "server-only";
import { cache } from "react";
import { notFound } from "next/navigation";
import { getDb } from "..";
import { getOven } from "./ovens";

/** The oven behind an /ovens/[ovenId] page, read once per request however many parts ask. */
export const loadOvenForPage = cache(async (rawId: string) => {
  const id = Number(rawId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const row = await getOven(await getDb(), id);
  if (!row) notFound();
  return row;
});
