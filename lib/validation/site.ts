import { z } from "zod";

const isTimeZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

export const siteCreateSchema = z.object({
  name: z.string({ error: "is required" }).trim().min(1, "is required").max(80),
  timeZone: z.string({ error: "is required" }).trim().refine(isTimeZone, "an IANA time zone such as Europe/Dublin"),
});

export const lineCreateSchema = z.object({
  siteId: z.coerce.number({ error: "choose a site" }).int().positive("choose a site"),
  name: z.string({ error: "is required" }).trim().min(1, "is required").max(80),
  kind: z.enum(["smt", "lab", "other"]).default("smt"),
});
