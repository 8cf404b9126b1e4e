import type { RateLimiterAbstract } from "rate-limiter-flexible";
import { isLimitRefusal } from "./shared-limiter";

type Lease = { left: number; blockedUntil: number };

export type RollAllowanceAnswer = { allowed: true } | { allowed: false; retryAfterMs: number };

/**
 * Each group's roll limit, counted in the shared store yet cheap per roll: the process takes `leaseSize` points at a
 * time from the shared limiter and spends them locally, so only one roll in `leaseSize` waits for PostgreSQL. A group
 * whose phone moves to another process leaves at most `leaseSize - 1` points unspent, which only tightens its limit.
 */
export class RollAllowance {
  private readonly leases = new Map<string, Lease>();
  private readonly pending = new Map<string, Promise<void>>();

  constructor(
    private readonly limiter: RateLimiterAbstract,
    private readonly leaseSize: number,
  ) {}

  /** The answer at once when this process can give it without the store; undefined when a lease must be taken first. */
  takeLocally(groupId: string, now = Date.now()): RollAllowanceAnswer | undefined {
    const lease = this.leases.get(groupId);
    if (!lease) return undefined;
    if (lease.blockedUntil > now) return { allowed: false, retryAfterMs: lease.blockedUntil - now };
    if (lease.left > 0) {
      lease.left -= 1;
      return { allowed: true };
    }
    return undefined;
  }

  /**
   * Takes a lease from the shared store, then answers for this roll. One lease request per group is in flight at a
   * time: rolls that arrive together wait for it and spend its points, instead of each taking a lease of their own.
   */
  async take(groupId: string): Promise<RollAllowanceAnswer> {
    for (;;) {
      const local = this.takeLocally(groupId);
      if (local) return local;
      const inFlight = this.pending.get(groupId);
      if (!inFlight) break;
      await inFlight;
    }
    if (this.leases.size > 10_000) this.forgetIdle();
    const request = this.requestLease(groupId);
    this.pending.set(
      groupId,
      request.then(() => undefined),
    );
    try {
      return await request;
    } finally {
      this.pending.delete(groupId);
    }
  }

  private async requestLease(groupId: string): Promise<RollAllowanceAnswer> {
    try {
      await this.limiter.consume(groupId, this.leaseSize);
      const lease = this.leases.get(groupId) ?? { left: 0, blockedUntil: 0 };
      lease.left += this.leaseSize - 1;
      lease.blockedUntil = 0;
      this.leases.set(groupId, lease);
      return { allowed: true };
    } catch (error) {
      if (!isLimitRefusal(error)) throw error;
      const retryAfterMs = Math.max(250, error.msBeforeNext);
      this.leases.set(groupId, { left: 0, blockedUntil: Date.now() + retryAfterMs });
      return { allowed: false, retryAfterMs };
    }
  }

  private forgetIdle() {
    const now = Date.now();
    for (const [groupId, lease] of this.leases) if (lease.left === 0 && lease.blockedUntil <= now) this.leases.delete(groupId);
  }
}
