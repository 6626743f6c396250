import { z } from "zod";
import { ROLES } from "@/db/schema/users";

export const emailField = z.string({ error: "is required" }).trim().toLowerCase().email("an e-mail address such as tech@plant.example");

export const passwordSignInSchema = z.object({
  email: emailField,
  password: z.string({ error: "is required" }).min(1, "is required").max(200),
});
export const magicLinkSchema = z.object({ email: emailField });

export const inviteSchema = z.object({
  email: emailField,
  name: z.string().trim().max(80).optional(),
  role: z.enum(ROLES, { error: "choose a role" }),
});

export const userAccessSchema = z.object({
  userId: z.string().min(1),
  role: z.enum(ROLES).optional(),
  active: z.preprocess((v) => (v === "true" ? true : v === "false" ? false : v), z.boolean().optional()),
});

export const setPasswordSchema = z
  .object({
    token: z.string().min(10),
    password: z.string().min(10, "at least 10 characters").max(200),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "does not match the password" });

export const tokenCreateSchema = z.object({
  userId: z.string().min(1, "choose a user"),
  name: z.string().trim().min(1, "is required").max(60),
  role: z.enum(ROLES).optional(),
});
export const tokenRevokeSchema = z.object({ tokenId: z.coerce.number().int().positive() });
