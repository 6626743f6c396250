import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { runAction } from "@/lib/action";
import { inviteUserDef } from "@/lib/actions/admin";
import { getUserByEmail } from "@/db/queries/users";
import { auditLog } from "@/db/schema/audit";
import { latestSinkMessages, startMailSink } from "@/lib/mail-sink";
import { actorFor, createTestDb } from "./test-db";

// An invitation is an account plus the e-mail that tells its owner: when the mail server does not
// take the message, no account may be left behind (a second try would meet "already has an account").
let t: Awaited<ReturnType<typeof createTestDb>>;
beforeAll(async () => {
  t = await createTestDb();
});
afterAll(() => t.close());

describe("inviting someone", () => {
  it("with the mail server down: a 503-style error that says why, and no account; once it is up, the invitation goes", async () => {
    const admin = await actorFor(t.db, "admin");
    const email = "new.starter@brightwater.example";
    // Nothing listens on the SMTP port yet.
    const down = await runAction(inviteUserDef, admin, { email, role: "technician" }, t.db);
    expect(down).toMatchObject({ ok: false, code: "unavailable" });
    expect((down as { message: string }).message).toMatch(/could not be e-mailed .*no account was made/);
    expect(await getUserByEmail(t.db, email)).toBeFalsy();
    const withdrawn = await t.db.select().from(auditLog).where(eq(auditLog.action, "user.invite_withdrawn"));
    expect(withdrawn).toHaveLength(1);

    const sink = await startMailSink({ db: t.db, port: Number(process.env.SMTP_SINK_PORT) });
    try {
      const up = await runAction(inviteUserDef, admin, { email, role: "technician" }, t.db);
      expect(up).toMatchObject({ ok: true, data: { email } });
      expect((await getUserByEmail(t.db, email))?.role).toBe("technician");
      const mail = (await latestSinkMessages(t.db)).find((m) => m.envelopeTo.includes(email));
      expect(mail?.subject).toBe("You have an Ovenward account");
    } finally {
      sink.close();
    }
  });
});
