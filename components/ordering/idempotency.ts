/** A fresh Idempotency-Key: random, 32 hex digits or a UUID. */
export function newIdempotencyKey(): string {
  const c = (globalThis as { crypto?: { randomUUID?: () => string; getRandomValues?: (a: Uint8Array) => Uint8Array } }).crypto;
  if (c?.randomUUID) return c.randomUUID();
  const bytes = new Uint8Array(16);
  if (c?.getRandomValues) c.getRandomValues(bytes);
  else for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(Math.random() * 256);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, "0")).join("");
}

/**
 * One key per attempt at a submission: the same request body sent again (a retry after a dropped
 * connection) reuses the key, so the server answers it once; a changed body gets a new key.
 */
export class IdempotencyKeeper {
  private last: { body: string; key: string } | null = null;

  keyFor(body: unknown): string {
    const text = JSON.stringify(body);
    if (!this.last || this.last.body !== text) this.last = { body: text, key: newIdempotencyKey() };
    return this.last.key;
  }

  /** After a definite answer (success), the next submission is a new attempt. */
  reset(): void {
    this.last = null;
  }
}
