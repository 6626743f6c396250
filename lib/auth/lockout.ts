// Repeated failed sign-ins for one account: slowed first, then refused for a while.
// Pure: the caller passes `now` and stores the result.
export const LOCKOUT = {
  windowMs: 15 * 60_000, // failures older than this are forgotten
  slowAfter: 3, // from the 3rd failure each answer is delayed
  stepDelayMs: 500,
  maxDelayMs: 3_000,
  lockAfter: 5, // the 5th failure locks the account
  lockMs: 15 * 60_000,
};

export type LockoutState = { failedSignIns: number; lastFailedSignInAt: Date | null; lockedUntil: Date | null };

export function isLocked(state: LockoutState, now: Date): boolean {
  return state.lockedUntil !== null && state.lockedUntil.getTime() > now.getTime();
}

export function afterFailure(state: LockoutState, now: Date): LockoutState & { delayMs: number } {
  const recent = state.lastFailedSignInAt && now.getTime() - state.lastFailedSignInAt.getTime() < LOCKOUT.windowMs;
  const failed = (recent ? state.failedSignIns : 0) + 1;
  const lockedUntil = failed >= LOCKOUT.lockAfter ? new Date(now.getTime() + LOCKOUT.lockMs) : state.lockedUntil;
  const delayMs = failed >= LOCKOUT.slowAfter ? Math.min((failed - LOCKOUT.slowAfter + 1) * LOCKOUT.stepDelayMs, LOCKOUT.maxDelayMs) : 0;
  return { failedSignIns: failed, lastFailedSignInAt: now, lockedUntil, delayMs };
}

export const AFTER_SUCCESS: LockoutState = { failedSignIns: 0, lastFailedSignInAt: null, lockedUntil: null };

export function lockedMessage(until: Date): string {
  const minutes = Math.max(1, Math.ceil((until.getTime() - Date.now()) / 60_000));
  return `Too many failed sign-ins for this account. It is locked for about ${minutes} more minute${minutes === 1 ? "" : "s"}; try again then, or ask an admin to help.`;
}
