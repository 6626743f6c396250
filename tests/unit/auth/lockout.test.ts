import { describe, expect, it } from "vitest";
import { AFTER_SUCCESS, afterFailure, isLocked, LOCKOUT } from "@/lib/auth/lockout";

const t0 = new Date("2026-12-02T08:00:00Z");
const at = (ms: number) => new Date(t0.getTime() + ms);

describe("sign-in lock-out", () => {
  it("slows from the third failure and locks at the fifth", () => {
    let s = { ...AFTER_SUCCESS, delayMs: 0 };
    const delays: number[] = [];
    for (let i = 0; i < 5; i++) {
      s = afterFailure(s, at(i * 1000));
      delays.push(s.delayMs);
    }
    expect(delays).toEqual([0, 0, 500, 1000, 1500]);
    expect(isLocked(s, at(5000))).toBe(true);
    expect(isLocked(s, at(4000 + LOCKOUT.lockMs + 1))).toBe(false);
  });
  it("forgets failures older than the window", () => {
    let s = { ...AFTER_SUCCESS, delayMs: 0 };
    for (let i = 0; i < 4; i++) s = afterFailure(s, at(i));
    s = afterFailure(s, at(LOCKOUT.windowMs + 10));
    expect(s.failedSignIns).toBe(1);
    expect(isLocked(s, at(LOCKOUT.windowMs + 11))).toBe(false);
  });
});
