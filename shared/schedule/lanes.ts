/** The bookkeeping of the backward pass: busy intervals per resource and a queue of chains. */

interface Interval { start: number; end: number }

/** Busy intervals of one resource, sorted by start, never overlapping. */
export class Lane {
  busy: Interval[] = [];
  /** The latest start s with s + dur ≤ latestEnd and [s, s + dur) free. */
  latestStart(latestEnd: number, dur: number): number {
    if (dur <= 0) return latestEnd;
    const b = this.busy;
    // first interval starting at or after latestEnd: everything from there on is irrelevant
    let lo = 0;
    let hi = b.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (b[mid].start < latestEnd) lo = mid + 1;
      else hi = mid;
    }
    let end = latestEnd;
    for (let i = lo - 1; i >= 0; i--) {
      const iv = b[i];
      if (iv.end <= end - dur) return end - dur;
      end = Math.min(end, iv.start);
    }
    return end - dur;
  }
  book(start: number, end: number) {
    if (end <= start) return;
    const b = this.busy;
    let lo = 0;
    let hi = b.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (b[mid].start < start) lo = mid + 1;
      else hi = mid;
    }
    b.splice(lo, 0, { start, end });
  }
}

/** A max-heap of chains by their cursor (the latest end of their next resource step). */
export class MaxHeap<T> {
  private a: { key: number; seq: number; v: T }[] = [];
  private seq = 0;
  get size() { return this.a.length; }
  push(key: number, v: T) {
    const a = this.a;
    a.push({ key, seq: this.seq++, v });
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (this.before(a[p], a[i])) break;
      [a[p], a[i]] = [a[i], a[p]];
      i = p;
    }
  }
  pop(): T | undefined {
    const a = this.a;
    if (!a.length) return undefined;
    const top = a[0];
    const last = a.pop()!;
    if (a.length) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < a.length && !this.before(a[m], a[l])) m = l;
        if (r < a.length && !this.before(a[m], a[r])) m = r;
        if (m === i) break;
        [a[m], a[i]] = [a[i], a[m]];
        i = m;
      }
    }
    return top.v;
  }
  /** x comes out before y: later key first, then first pushed. */
  private before(x: { key: number; seq: number }, y: { key: number; seq: number }) {
    return x.key > y.key || (x.key === y.key && x.seq < y.seq);
  }
}
