/** An AuthnRequest the fake has validated and is waiting to answer. */
export interface PendingRequest {
  requestId: string;
  relayState?: string;
  receivedAt: number;
}

/** How long the person may take to pick someone on the sign-in page. */
export const PENDING_LIFETIME_MS = 10 * 60_000;
const MAX_PENDING = 1000;

/**
 * Short-lived, in-memory store of validated AuthnRequests, keyed by request ID. Each entry is
 * taken once, so a request cannot be answered twice; old entries are dropped as new ones arrive.
 */
export class PendingRequests {
  private readonly byId = new Map<string, PendingRequest>();

  constructor(private readonly clock: () => number = Date.now) {}

  /** Remembers a validated request. */
  add(requestId: string, relayState?: string): void {
    this.prune();
    if (this.byId.size >= MAX_PENDING) {
      const oldest = this.byId.keys().next().value;
      if (oldest !== undefined) this.byId.delete(oldest);
    }
    this.byId.set(requestId, { requestId, relayState, receivedAt: this.clock() });
  }

  /** Removes and returns the request if it is known and still fresh. */
  take(requestId: string): PendingRequest | undefined {
    const pending = this.byId.get(requestId);
    this.byId.delete(requestId);
    if (!pending || this.clock() - pending.receivedAt > PENDING_LIFETIME_MS) return undefined;
    return pending;
  }

  private prune(): void {
    const cutoff = this.clock() - PENDING_LIFETIME_MS;
    for (const [id, pending] of this.byId) {
      if (pending.receivedAt >= cutoff) break; // insertion order = age order
      this.byId.delete(id);
    }
  }
}
