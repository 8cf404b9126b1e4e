import { RateLimiterMemory } from "rate-limiter-flexible";
import { describe, expect, it } from "vitest";
import { RollAllowance } from "../../../server/limits/roll-allowance";

describe("RollAllowance", () => {
  it("lets rolls that arrive together share one lease instead of each taking a lease of its own", async () => {
    const limiter = new RateLimiterMemory({ keyPrefix: "allowance-together", points: 60, duration: 15 });
    const allowance = new RollAllowance(limiter, 5);
    const answers = await Promise.all(Array.from({ length: 20 }, () => allowance.take("group-a")));
    expect(answers.every((answer) => answer.allowed)).toBe(true);
    // 20 rolls need 4 leases of 5 points: 20 of the 60 points, not 20 leases.
    expect((await limiter.get("group-a"))?.consumedPoints).toBe(20);
  });

  it("refuses the rolls past the shared allowance with the wait", async () => {
    const limiter = new RateLimiterMemory({ keyPrefix: "allowance-past", points: 10, duration: 15 });
    const allowance = new RollAllowance(limiter, 5);
    const answers = await Promise.all(Array.from({ length: 14 }, () => allowance.take("group-b")));
    expect(answers.filter((answer) => answer.allowed)).toHaveLength(10);
    const refused = answers.find((answer) => !answer.allowed);
    expect(refused && !refused.allowed && refused.retryAfterMs).toBeGreaterThan(0);
  });
});
