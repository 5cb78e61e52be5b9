// settledWithin: the promise's value when it is in time, the fallback when it is not, and no timer left behind.
import { afterEach, describe, expect, it, vi } from "vitest";
import { settledWithin } from "./time-limit";

afterEach(() => vi.useRealTimers());

describe("settledWithin", () => {
  it("answers the promise's value when it settles in time and clears its timer", async () => {
    vi.useFakeTimers();
    const answer = settledWithin(Promise.resolve("state"), 250, null);
    await expect(answer).resolves.toBe("state");
    expect(vi.getTimerCount()).toBe(0);
  });

  it("answers the fallback once the time is up", async () => {
    vi.useFakeTimers();
    const answer = settledWithin(new Promise<string>(() => {}), 250, null);
    await vi.advanceTimersByTimeAsync(250);
    await expect(answer).resolves.toBeNull();
  });

  it("passes a rejection on, for the caller to handle", async () => {
    await expect(settledWithin(Promise.reject(new Error("down")), 250, null)).rejects.toThrow("down");
  });
});
