/**
 * A token bucket: `rate` tokens per second, at most `burst` saved up. One per socket, so a
 * runaway client is refused without slowing anyone else.
 */
export class TokenBucket {
  private tokens: number
  private last: number

  constructor(
    private readonly rate: number,
    private readonly burst: number,
    private readonly now: () => number = () => performance.now(),
  ) {
    this.tokens = burst
    this.last = now()
  }

  /** Takes one token if there is one. */
  take(): boolean {
    const now = this.now()
    this.tokens = Math.min(this.burst, this.tokens + ((now - this.last) / 1000) * this.rate)
    this.last = now
    if (this.tokens < 1) return false
    this.tokens -= 1
    return true
  }
}
