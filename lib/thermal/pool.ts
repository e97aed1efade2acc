/**
 * Scratch storage for one solve. Allocating typed arrays is what a small solve spends much of its
 * time on (each has its own off-heap backing store for the garbage collector to track), so the
 * per-cell arrays of a solve are views into one reused buffer. Solves are synchronous and never
 * nest, so one buffer suffices; if one were ever borrowed twice, the second borrower simply gets
 * fresh arrays. Nothing returned to a caller refers to it (results are copied out).
 *
 * Views are handed out in order by `take`. A solve asks for the same lengths in the same order as
 * the previous one whenever the cell count repeats (one cable at many currents, a bisection on
 * current), so the previous solve's views are handed out again instead of being re-made: a
 * subarray costs about 0.1 µs and a solve takes some twenty of them.
 */

/** Where a solve gets its per-cell arrays. */
export interface ArraySource {
  /** An array of `length` doubles (zero-filled when borrowed, see borrowScratch). */
  take(length: number): Float64Array;
}

export interface Scratch extends ArraySource {
  /** Call when the solve is done; the arrays may then be handed to the next solve. */
  release(): void;
}

class SharedScratch implements Scratch {
  buffer = new Float64Array(4096);
  borrowed = false;
  /** Doubles this borrower may take, and has taken. */
  size = 0;
  offset = 0;
  /** Views handed out, in order; reused while lengths and offsets repeat. */
  views: Float64Array[] = [];
  next = 0;

  lend(size: number): Scratch {
    if (this.buffer.length < size) {
      this.buffer = new Float64Array(Math.max(size, 2 * this.buffer.length));
      this.views = [];
    }
    this.buffer.fill(0, 0, size);
    this.borrowed = true;
    this.size = size;
    this.offset = 0;
    this.next = 0;
    return this;
  }

  take(length: number): Float64Array {
    const start = this.offset;
    this.offset += length;
    if (this.offset > this.size) throw new Error(`scratch overrun: ${this.offset} of ${this.size} doubles`);
    let view = this.views[this.next];
    if (view === undefined || view.length !== length || view.byteOffset !== start * Float64Array.BYTES_PER_ELEMENT) {
      view = this.buffer.subarray(start, start + length);
      this.views[this.next] = view;
    }
    this.next++;
    return view;
  }

  release(): void {
    this.borrowed = false;
  }
}

class FreshArrays implements Scratch {
  take(length: number): Float64Array {
    return new Float64Array(length);
  }

  release(): void {}
}

/** One new buffer, handed out as consecutive views: storage that outlives a solve, in one allocation. */
class Slab implements ArraySource {
  private readonly buffer: Float64Array;
  private offset = 0;

  constructor(size: number) {
    this.buffer = new Float64Array(size);
  }

  take(length: number): Float64Array {
    const start = this.offset;
    this.offset += length;
    // Past the planned size (a caller that asks for more than it sized), fall back to a fresh array.
    if (this.offset > this.buffer.length) return new Float64Array(length);
    return this.buffer.subarray(start, this.offset);
  }
}

const shared = new SharedScratch();

/** Fresh zero-filled arrays each time: for storage that outlives one solve. */
export const freshArrays: ArraySource = new FreshArrays();

/**
 * Zero-filled arrays for storage that outlives one solve (a prepared problem), carved out of one
 * buffer of `size` doubles: one backing store for the garbage collector instead of some twenty.
 */
export function slabArrays(size: number): ArraySource {
  return new Slab(size);
}

/** Room for `size` doubles, zero-filled, taken in order; call `release` when the solve is done. */
export function borrowScratch(size: number): Scratch {
  return shared.borrowed ? new FreshArrays() : shared.lend(size);
}
