import { describe, expect, it } from "vitest";
import { signUnsubscribeToken, verifyUnsubscribeToken } from "@/lib/mail-token";

const SECRET = "test-secret-0123456789";
const payload = { userId: "user-1", kind: "fleet_digest", expiresAt: new Date(1_800_000_000_000) };

describe("signed unsubscribe tokens", () => {
  it("match an independent HMAC-SHA256 (Python's hmac module)", () => {
    // python3: body = b64url(json.dumps({"u":"user-1","k":"fleet_digest","e":1800000000000}, separators=(",",":")))
    //          sig  = b64url(hmac.new(b"test-secret-0123456789", b"unsubscribe.v1." + body, sha256).digest())
    expect(signUnsubscribeToken(payload, SECRET)).toBe(
      "eyJ1IjoidXNlci0xIiwiayI6ImZsZWV0X2RpZ2VzdCIsImUiOjE4MDAwMDAwMDAwMDB9.gPCaNW1vdILXovOzSYTLaFlsu6S_mXBAvXLzPIlAGdU",
    );
  });
  it("verify until the expiry instant, not at it", () => {
    const token = signUnsubscribeToken(payload, SECRET);
    expect(verifyUnsubscribeToken(token, new Date(1_799_999_999_999), SECRET)).toEqual({ ok: true, payload });
    expect(verifyUnsubscribeToken(token, new Date(1_800_000_000_000), SECRET)).toEqual({ ok: false, reason: "expired" });
  });
  it("refuse another secret, a changed payload, a cut signature and garbage", () => {
    const token = signUnsubscribeToken(payload, SECRET);
    const [body, sig] = token.split(".");
    expect(verifyUnsubscribeToken(token, new Date(0), "another-secret-0123456789")).toMatchObject({ reason: "bad_signature" });
    const longer = Buffer.from(JSON.stringify({ u: "user-1", k: "fleet_digest", e: 1_900_000_000_000 })).toString("base64url");
    expect(verifyUnsubscribeToken(`${longer}.${sig}`, new Date(0), SECRET)).toMatchObject({ reason: "bad_signature" });
    expect(verifyUnsubscribeToken(`${body}.${sig.slice(0, 20)}`, new Date(0), SECRET)).toMatchObject({ reason: "bad_signature" });
    for (const bad of ["", "abc", "a.b.c", `.${sig}`]) expect(verifyUnsubscribeToken(bad, new Date(0), SECRET).ok).toBe(false);
  });
});
