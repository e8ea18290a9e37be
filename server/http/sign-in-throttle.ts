// Throttling of password guesses, keyed by account *and* client address. After a few failures from one address on
// one account, each further attempt from there must wait, and the wait doubles with every failure up to a cap. A
// success clears the key. Someone guessing an account's password from elsewhere never locks its owner out, and a
// typo or two costs nothing. Entries expire after the window, so memory stays bounded by recent failures.

export interface SignInThrottleSettings {
  /** Failures forgiven before waits begin. */
  freeFailures: number;
  /** The first wait; each later failure doubles it. */
  baseDelayMs: number;
  maxDelayMs: number;
  /** A key with no failure for this long is forgotten. */
  forgetAfterMs: number;
}

export const defaultSignInThrottle: SignInThrottleSettings = {
  freeFailures: 3,
  baseDelayMs: 2_000,
  maxDelayMs: 5 * 60_000,
  forgetAfterMs: 15 * 60_000,
};

interface Entry {
  failures: number;
  lastFailureAt: number;
  retryAt: number;
}

/** Upper bound on remembered keys; beyond it the oldest are dropped first (a Map keeps insertion order). */
const MAX_KEYS = 100_000;

export class SignInThrottle {
  private readonly entries = new Map<string, Entry>();

  constructor(
    private readonly settings: SignInThrottleSettings,
    private readonly now: () => number = Date.now,
  ) {}

  /** Milliseconds the caller must still wait before trying this account from this address, 0 when free. */
  waitMs(account: string, address: string): number {
    const entry = this.live(key(account, address));
    return entry ? Math.max(0, entry.retryAt - this.now()) : 0;
  }

  recordFailure(account: string, address: string): void {
    const k = key(account, address);
    const t = this.now();
    const failures = (this.live(k)?.failures ?? 0) + 1;
    const over = failures - this.settings.freeFailures;
    const delay = over <= 0 ? 0 : Math.min(this.settings.maxDelayMs, this.settings.baseDelayMs * 2 ** (over - 1));
    this.entries.delete(k);
    this.entries.set(k, { failures, lastFailureAt: t, retryAt: t + delay });
    if (this.entries.size > MAX_KEYS) this.entries.delete(this.entries.keys().next().value!);
  }

  recordSuccess(account: string, address: string): void {
    this.entries.delete(key(account, address));
  }

  private live(k: string): Entry | undefined {
    const entry = this.entries.get(k);
    if (entry && this.now() - entry.lastFailureAt > this.settings.forgetAfterMs) {
      this.entries.delete(k);
      return undefined;
    }
    return entry;
  }
}

const key = (account: string, address: string) => `${account.trim().toLowerCase()}\u0000${address}`;

export function waitMessage(ms: number): string {
  const seconds = Math.ceil(ms / 1000);
  const amount =
    seconds < 60
      ? `${seconds} second${seconds === 1 ? "" : "s"}`
      : `${Math.ceil(seconds / 60)} minute${Math.ceil(seconds / 60) === 1 ? "" : "s"}`;
  return `Too many failed sign-in attempts for this account from your address. Wait ${amount} and try again.`;
}
