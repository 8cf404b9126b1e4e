import type { FinderObjective } from "../schemas/set-finder";

/** Weight that puts the largest face ahead of the face total in the small-faces order (face totals stay far below it). */
export const LARGEST_FACE_WEIGHT = 100_000;

/** A set the search found, before the exact engine checks it: dice in cycle order, faces ascending. */
export interface Candidate {
  faces: number[][];
  /** The second cycle (two-cycles only), as positions in `faces`. */
  secondCycle: number[] | null;
  /** The weakest winning chance the property relies on, in outcomes out of facesPerDie^4 (one-die counts scaled by facesPerDie^2). */
  strength: number;
  /** Largest face minus the lowest allowed value. */
  largestSpan: number;
  /** Sum over all faces of (face − lowest allowed value). */
  totalSpan: number;
  /** The dice as a set, whatever their order: sorted face lists joined. */
  key: string;
}

/** The small-faces order's main key: largest face first, then the face total. */
export function smallFacesKey(largestSpan: number, totalSpan: number): number {
  return largestSpan * LARGEST_FACE_WEIGHT + totalSpan;
}

/** The key naming a set of dice whatever their order. */
export function setKey(faces: readonly (readonly number[])[]): string {
  return faces
    .map((die) => die.join(","))
    .sort()
    .join(" | ");
}

/**
 * Negative when `a` ranks above `b`. strongest-cycle: strength, then smaller face total, then key;
 * small-faces: smaller largest face, smaller face total, then strength, then key. A total order, so results do not depend on search order.
 */
export function compareCandidates(objective: FinderObjective, a: Candidate, b: Candidate): number {
  if (objective === "strongest-cycle") {
    if (a.strength !== b.strength) return b.strength - a.strength;
    if (a.totalSpan !== b.totalSpan) return a.totalSpan - b.totalSpan;
  } else {
    const small = smallFacesKey(a.largestSpan, a.totalSpan) - smallFacesKey(b.largestSpan, b.totalSpan);
    if (small !== 0) return small;
    if (a.strength !== b.strength) return b.strength - a.strength;
  }
  return a.key < b.key ? -1 : a.key > b.key ? 1 : 0;
}

/** The score shown with a result: higher is better, ordered as `compareCandidates` orders (bar the key). */
export function candidateScore(objective: FinderObjective, candidate: Candidate, facesPerDie: number): number {
  const weakest = candidate.strength / facesPerDie ** 4;
  return objective === "strongest-cycle" ? weakest : weakest - smallFacesKey(candidate.largestSpan, candidate.totalSpan);
}

/** The best `capacity` candidates so far, one per set of dice, best first. */
export class TopList {
  private entries: Candidate[] = [];
  private byKey = new Map<string, Candidate>();
  /** When full: the worst kept strength and small-faces key, for bounds in the search loops. */
  worstStrength = 0;
  worstSmallKey = Number.POSITIVE_INFINITY;

  constructor(
    readonly objective: FinderObjective,
    readonly capacity: number,
  ) {}

  get full(): boolean {
    return this.entries.length >= this.capacity;
  }

  /** Keeps the candidate if it ranks among the best (replacing a worse ordering of the same set); answers whether it was kept. */
  offer(candidate: Candidate): boolean {
    const existing = this.byKey.get(candidate.key);
    if (existing !== undefined) {
      if (compareCandidates(this.objective, candidate, existing) >= 0) return false;
      this.entries.splice(this.entries.indexOf(existing), 1);
    } else if (this.full && compareCandidates(this.objective, candidate, this.entries[this.entries.length - 1]) >= 0) {
      return false;
    }
    let position = this.entries.length;
    while (position > 0 && compareCandidates(this.objective, candidate, this.entries[position - 1]) < 0) position -= 1;
    this.entries.splice(position, 0, candidate);
    this.byKey.set(candidate.key, candidate);
    if (this.entries.length > this.capacity) this.byKey.delete(this.entries.pop()!.key);
    this.refreshWorst();
    return true;
  }

  /** Whether a set with these figures could still enter (true while the list is not full). */
  couldEnter(strength: number, largestSpan: number, totalSpan: number): boolean {
    if (!this.full) return true;
    return this.objective === "strongest-cycle"
      ? strength >= this.worstStrength
      : smallFacesKey(largestSpan, totalSpan) <= this.worstSmallKey;
  }

  /** The kept candidates, best first. */
  list(): Candidate[] {
    return [...this.entries];
  }

  private refreshWorst() {
    if (!this.full) return;
    const worst = this.entries[this.entries.length - 1];
    this.worstStrength = worst.strength;
    this.worstSmallKey = smallFacesKey(worst.largestSpan, worst.totalSpan);
  }
}
