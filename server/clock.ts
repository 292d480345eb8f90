/** The server's clock. Services ask it for "now" so tests can set the time instead of waiting. */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock for tests: starts at a given instant and moves only when told. */
export class FixedClock implements Clock {
  private current: number;
  constructor(start: Date | string) {
    this.current = new Date(start).getTime();
  }
  now(): Date {
    return new Date(this.current);
  }
  set(instant: Date | string): void {
    this.current = new Date(instant).getTime();
  }
  advance(ms: number): void {
    this.current += ms;
  }
}
