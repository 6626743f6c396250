import "server-only";
import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";
import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { createElement } from "react";
import { headers as requestHeaders } from "next/headers";
import { getDb } from "@/db";
import { accounts, sessions, users, verificationTokens } from "@/db/schema/users";
import { checkPassword, getUserByEmail } from "@/db/queries/users";
import { passwordSignInSchema } from "@/lib/validation/user";
import { env } from "./env";
import { sendMail } from "./mail";
import { MagicLinkEmail } from "@/emails/magic-link";
import { countSignInAttempt, refundSignInAttempt } from "./auth/sign-in-limit";

export class AccountLockedError extends CredentialsSignin {
  code = "locked";
}

/** Too many failed sign-ins from the caller's address (lib/auth/sign-in-limit.ts). */
export class SignInRateLimitedError extends CredentialsSignin {
  code = "rate_limited";
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** The request's headers; none outside a request (a script calling the library directly). */
async function headersOrNone(): Promise<Headers> {
  try {
    return new Headers(await requestHeaders());
  } catch {
    return new Headers();
  }
}

export const { handlers, auth, signIn, signOut } = NextAuth(async () => {
  const db = await getDb();
  return {
    trustHost: true,
    secret: env().AUTH_SECRET ?? (env().NODE_ENV === "production" && env().DEMO_MODE !== "on" ? undefined : "ovenward-development-secret-change-me"),
    adapter: DrizzleAdapter(db, { usersTable: users, accountsTable: accounts, sessionsTable: sessions, verificationTokensTable: verificationTokens }),
    session: { strategy: "jwt", maxAge: 12 * 3600 },
    pages: { signIn: "/sign-in", verifyRequest: "/sign-in/check-email", error: "/sign-in" },
    providers: [
      Credentials({
        credentials: { email: {}, password: {} },
        // Both the sign-in form's action and a direct POST to /api/auth/callback/credentials end
        // here, so the per-address limit is checked here, before the password is.
        async authorize(raw, request) {
          const headers = request?.headers ?? new Headers();
          if (!countSignInAttempt(headers).allowed) throw new SignInRateLimitedError();
          const parsed = passwordSignInSchema.safeParse(raw);
          if (!parsed.success) return null;
          const result = await checkPassword(db, parsed.data.email, parsed.data.password);
          if (result.kind === "ok") refundSignInAttempt(headers);
          if (result.kind === "locked") throw new AccountLockedError();
          if (result.kind === "bad") {
            if (result.delayMs) await sleep(result.delayMs);
            return null;
          }
          return { id: result.user.id, email: result.user.email, name: result.user.name };
        },
      }),
      Nodemailer({
        server: env().SMTP_URL,
        from: env().MAIL_FROM,
        async sendVerificationRequest({ identifier, url }) {
          await sendMail({ to: identifier, subject: "Your Ovenward sign-in link", element: createElement(MagicLinkEmail, { url, host: new URL(url).host }) });
        },
      }),
    ],
    callbacks: {
      // Only existing, active accounts may sign in; a magic link never creates an account.
      async signIn({ user, email }) {
        // Every magic-link request counts against the caller's address, before the account is
        // looked up, so the limit answers the same for known and unknown addresses.
        if ((email as { verificationRequest?: boolean } | undefined)?.verificationRequest && !countSignInAttempt(await headersOrNone()).allowed)
          return "/sign-in?error=AccessDenied&code=rate_limited";
        const address = user?.email ?? (email as { email?: string } | undefined)?.email;
        if (!address) return false;
        const row = await getUserByEmail(db, address);
        return Boolean(row?.active);
      },
      async jwt({ token, user }) {
        if (user?.email) {
          const row = await getUserByEmail(db, user.email);
          if (row) {
            token.sub = row.id;
            token.role = row.role;
          }
        }
        return token;
      },
      async session({ session, token }) {
        if (token.sub) session.user.id = token.sub;
        (session.user as { role?: unknown }).role = token.role;
        return session;
      },
    },
  };
});
