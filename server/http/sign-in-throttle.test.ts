import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { SignInThrottle, waitMessage, type SignInThrottleSettings } from "./sign-in-throttle";

const settings: SignInThrottleSettings = {
  freeFailures: 3,
  baseDelayMs: 1000,
  maxDelayMs: 60_000,
  forgetAfterMs: 600_000,
};

function clocked() {
  let now = 1_000_000;
  return { throttle: new SignInThrottle(settings, () => now), advance: (ms: number) => (now += ms) };
}

describe("SignInThrottle", () => {
  it("forgives the first failures, then doubles the wait with every failure up to the cap", () => {
    const { throttle } = clocked();
    const waits: number[] = [];
    for (let i = 0; i < 10; i++) {
      throttle.recordFailure("lena@example.org", "10.0.0.1");
      waits.push(throttle.waitMs("lena@example.org", "10.0.0.1"));
    }
    expect(waits).toEqual([0, 0, 0, 1000, 2000, 4000, 8000, 16000, 32000, 60000]);
  });

  it("never makes the owner wait from another address, whatever is guessed elsewhere", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.constantFrom("a@x.org", "b@x.org"), fc.constantFrom("10.0.0.1", "10.0.0.2")), {
          maxLength: 60,
        }),
        (failures) => {
          const { throttle } = clocked();
          for (const [account, address] of failures) throttle.recordFailure(account, address);
          expect(throttle.waitMs("a@x.org", "192.0.2.7")).toBe(0);
        },
      ),
      { seed: 20261203, numRuns: 200 },
    );
  });

  it("a success clears the key, and a key with no failure for the forget period starts over", () => {
    const { throttle, advance } = clocked();
    for (let i = 0; i < 6; i++) throttle.recordFailure("A@x.org ", "10.0.0.1");
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBeGreaterThan(0);
    throttle.recordSuccess("a@x.org", "10.0.0.1");
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBe(0);
    for (let i = 0; i < 6; i++) throttle.recordFailure("a@x.org", "10.0.0.1");
    advance(settings.forgetAfterMs + 1);
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBe(0);
    throttle.recordFailure("a@x.org", "10.0.0.1");
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBe(0);
  });

  it("the wait runs down with the clock", () => {
    const { throttle, advance } = clocked();
    for (let i = 0; i < 5; i++) throttle.recordFailure("a@x.org", "10.0.0.1");
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBe(2000);
    advance(1500);
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBe(500);
    advance(600);
    expect(throttle.waitMs("a@x.org", "10.0.0.1")).toBe(0);
  });

  it("waitMessage says seconds under a minute and rounds minutes up", () => {
    expect(waitMessage(1000)).toMatch(/Wait 1 second and/);
    expect(waitMessage(30_500)).toMatch(/Wait 31 seconds and/);
    expect(waitMessage(61_000)).toMatch(/Wait 2 minutes and/);
  });
});
