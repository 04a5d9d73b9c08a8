/**
 * Exact "fewest pieces" solver for stacks built from a box of physical pieces (gauge blocks),
 * each used at most once, working on integer multiples of the box's finest decimal step.
 *
 * Method: iterative deepening on the number of pieces k, starting at a lower bound, with a
 * depth-first search over pieces in descending size (so a found stack is already in wringing
 * order, largest first). Each node is pruned by two exact lower bounds on the pieces still needed
 * for a remainder r from pieces i…n−1:
 *  - size: the fewest of the largest remaining pieces whose sum reaches r;
 *  - residue: the fewest remaining pieces whose sum has r's residue modulo M (a power of ten,
 *    one whole unit), from a table built once per box by dynamic programming — this is the
 *    "eliminate the last digits first" rule made exact.
 * Searching for exactly k pieces also prunes by the sum of the k smallest remaining pieces and by
 * how far k pieces can reach when some of them must be small pieces that fix the last digits; equal
 * sizes are tried once per level, and failed (i, r, k) states are remembered.
 * The first k at which a stack is found is the minimum, so the answer is exact.
 */
/** Search steps allowed per solve: standard sets need at most a few thousand; this bounds a pathological custom box. */
export const MAX_NODES = 2_000_000;

/** Fine/coarse split of the pieces by divisibility by `modulus`, for {@link StackSolver}'s reach bound. */
interface ResidueClass {
  modulus: number;
  /** Fewest fine-or-coarse pieces from i… with a given residue mod `modulus` (255: none). */
  residue: Uint8Array;
  /** Number of fine pieces before index i. */
  fineBefore: Int32Array;
  /** Prefix sums of the fine pieces in descending order. */
  fineSum: Float64Array;
  /** Prefix sums of the coarse pieces in descending order. */
  coarseSum: Float64Array;
}

/** Largest target (in steps) the memo keys can hold exactly. */
export const MAX_TARGET = Math.floor(Number.MAX_SAFE_INTEGER / 512 / 512);

export class StackSolver {
  /** Piece sizes in integer steps, largest first (one entry per physical piece). */
  readonly sizes: readonly number[];
  /** Sum of all pieces. */
  readonly total: number;
  private readonly n: number;
  private readonly prefix: Float64Array;
  private readonly modulus: number;
  private readonly residue: Uint8Array;
  private readonly classes: ResidueClass[];
  private failed = new Set<number>();
  private nodes = 0;

  /** @param sizes piece sizes in integer steps (any order); @param modulus residue modulus M. */
  constructor(sizes: readonly number[], modulus: number) {
    this.sizes = [...sizes].sort((a, b) => b - a);
    this.n = this.sizes.length;
    this.prefix = new Float64Array(this.n + 1);
    for (let i = 0; i < this.n; i++) this.prefix[i + 1] = this.prefix[i] + this.sizes[i];
    this.total = this.prefix[this.n];
    this.modulus = Math.max(1, modulus);
    this.residue = this.buildResidueTable(this.modulus);
    this.classes = this.buildClasses();
  }

  /** Nodes visited by the last {@link solve} call (for benchmarks). */
  get lastNodeCount(): number {
    return this.nodes;
  }

  /** min pieces from i…n−1 whose sum ≡ ρ (mod M); 255 when no subset has that residue. */
  private buildResidueTable(m: number): Uint8Array {
    const table = new Uint8Array((this.n + 1) * m).fill(255);
    table[this.n * m] = 0;
    for (let i = this.n - 1; i >= 0; i--) {
      const row = i * m;
      const next = (i + 1) * m;
      const w = this.sizes[i] % m;
      for (let rho = 0; rho < m; rho++) {
        const skip = table[next + rho];
        const prev = table[next + ((rho - w + m) % m)];
        const take = prev === 255 ? 255 : prev + 1;
        table[row + rho] = skip < take ? skip : take;
      }
    }
    return table;
  }

  /**
   * For each divisor d of M of the form 10^j or 5·10^j, the pieces split into "fine" (not a
   * multiple of d) and "coarse"; a remainder whose residue mod d needs f fine pieces can use at
   * most k − f coarse ones, which caps how far k pieces reach. Classes where every piece is coarse
   * or every piece is fine add nothing and are dropped.
   */
  private buildClasses(): ResidueClass[] {
    const out: ResidueClass[] = [];
    for (let p = 5; p < this.modulus; p *= 10) {
      for (const d of [p, p * 2]) {
        if (this.modulus % d !== 0) continue;
        const fine = this.sizes.map((w) => w % d !== 0);
        const fineCount = fine.filter(Boolean).length;
        if (fineCount === 0 || fineCount === this.n) continue;
        const fineBefore = new Int32Array(this.n + 1);
        const fineSum = new Float64Array(fineCount + 1);
        const coarseSum = new Float64Array(this.n - fineCount + 1);
        let f = 0;
        let c = 0;
        for (let i = 0; i < this.n; i++) {
          fineBefore[i] = f;
          if (fine[i]) fineSum[++f] = fineSum[f - 1] + this.sizes[i];
          else coarseSum[++c] = coarseSum[c - 1] + this.sizes[i];
        }
        fineBefore[this.n] = f;
        out.push({ modulus: d, residue: this.buildResidueTable(d), fineBefore, fineSum, coarseSum });
      }
    }
    return out;
  }

  /** Largest sum exactly k pieces from i…n−1 can reach while matching r's residue in every class. */
  private reach(i: number, k: number, r: number): number {
    let best = this.prefix[Math.min(i + k, this.n)] - this.prefix[i];
    for (const cls of this.classes) {
      const need = cls.residue[i * cls.modulus + (r % cls.modulus)];
      if (need === 255) return -Infinity;
      const f0 = cls.fineBefore[i];
      const fineInTop = cls.fineBefore[Math.min(i + k, this.n)] - f0;
      if (fineInTop >= need) continue;
      // The best k pieces with at least `need` fine ones take as few fine ones as allowed (each extra
      // fine piece would push out a larger coarse one): the largest j fine and k − j coarse.
      const c0 = i - f0;
      const fineAvail = cls.fineSum.length - 1 - f0;
      const coarseAvail = cls.coarseSum.length - 1 - c0;
      const j = Math.max(need, k - coarseAvail);
      if (j > fineAvail) return -Infinity;
      const sum = cls.fineSum[f0 + j] - cls.fineSum[f0] + cls.coarseSum[c0 + k - j] - cls.coarseSum[c0];
      if (sum < best) best = sum;
    }
    return best;
  }

  /** Lower bound on the pieces from i…n−1 that sum to r > 0 (Infinity if none can). */
  private lowerBound(i: number, r: number): number {
    const res = this.residue[i * this.modulus + (r % this.modulus)];
    if (res === 255) return Infinity;
    const available = this.prefix[this.n] - this.prefix[i];
    if (available < r) return Infinity;
    // Smallest k with the k largest remaining pieces reaching r (binary search on prefix sums).
    let lo = 1;
    let hi = this.n - i;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.prefix[i + mid] - this.prefix[i] >= r) hi = mid;
      else lo = mid + 1;
    }
    return Math.max(lo, res);
  }

  /** First index ≥ i whose piece is ≤ r (sizes are descending). */
  private firstFitting(i: number, r: number): number {
    let lo = i;
    let hi = this.n;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.sizes[mid] > r) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  /** Sum of the `k` smallest pieces among i…n−1 (Infinity if fewer than k remain). */
  private smallestSum(i: number, k: number): number {
    return this.n - k < i ? Infinity : this.prefix[this.n] - this.prefix[this.n - k];
  }

  /** Can exactly k pieces from i…n−1 sum to r? Fills `path` (smallest first) when they can. */
  private search(i: number, r: number, k: number, path: number[]): boolean {
    if (k === 0) return r === 0;
    if (r <= 0 || i >= this.n) return false;
    if (++this.nodes > MAX_NODES) throw new Error(`StackSolver: gave up after ${MAX_NODES} search steps; use a smaller box`);
    if (this.lowerBound(i, r) > k || this.smallestSum(i, k) > r || this.reach(i, k, r) < r) return false;
    const key = (r * 512 + i) * 512 + k;
    if (this.failed.has(key)) return false;
    // The piece taken now leaves k − 1 pieces, which need at least their smallest sum.
    const start = this.firstFitting(i, r - this.smallestSum(i + 1, k - 1));
    for (let j = start; j < this.n; j++) {
      const w = this.sizes[j];
      if (j > start && w === this.sizes[j - 1]) continue;
      // The k largest pieces from j on cannot reach r, and later j are smaller still.
      if (this.prefix[Math.min(j + k, this.n)] - this.prefix[j] < r) break;
      if (this.search(j + 1, r - w, k - 1, path)) {
        path.push(w);
        return true;
      }
    }
    this.failed.add(key);
    return false;
  }

  /**
   * The fewest pieces summing exactly to `target` (integer steps), largest first, or null when no
   * combination of the pieces makes it. `maxPieces` caps the search depth.
   */
  solve(target: number, maxPieces = this.n): number[] | null {
    this.nodes = 0;
    if (!Number.isSafeInteger(target) || target <= 0) return null;
    if (this.n > 511) throw new Error('StackSolver: at most 511 pieces');
    if (target > MAX_TARGET) throw new Error(`StackSolver: target must be at most ${MAX_TARGET} steps`);
    this.failed = new Set();
    const first = this.lowerBound(0, target);
    if (!Number.isFinite(first)) return null;
    for (let k = first; k <= Math.min(maxPieces, this.n); k++) {
      // Even the k smallest pieces are too long: no larger k can work either.
      if (this.smallestSum(0, k) > target) return null;
      const path: number[] = [];
      if (this.search(0, target, k, path)) return path.reverse();
    }
    return null;
  }
}
