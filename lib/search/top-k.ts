/** The best k (score, id) pairs seen so far, kept sorted; ties are broken by the smaller id. */
import { before } from "./entry";

export class TopK<T extends { id: string }> {
  readonly scores: number[] = [];
  readonly items: T[] = [];

  constructor(private readonly k: number) {}

  get full(): boolean {
    return this.items.length >= this.k;
  }

  /** Score an entry must reach to be considered at all (ties with the last may still enter on id). */
  get floor(): number {
    return this.full ? (this.scores[this.scores.length - 1] ?? -Infinity) : -Infinity;
  }

  offer(score: number, item: T): void {
    const n = this.items.length;
    if (n >= this.k) {
      const last = this.items[n - 1];
      if (last && !before(score, item.id, this.scores[n - 1] ?? -Infinity, last.id)) return;
    }
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      const other = this.items[mid];
      if (other && before(this.scores[mid] ?? -Infinity, other.id, score, item.id)) lo = mid + 1;
      else hi = mid;
    }
    this.scores.splice(lo, 0, score);
    this.items.splice(lo, 0, item);
    if (this.items.length > this.k) {
      this.scores.pop();
      this.items.pop();
    }
  }
}
