/**
 * Scratch storage for one solve. Allocating typed arrays is what a small solve spends much of its
 * time on (each has its own off-heap backing store for the garbage collector to track), so the
 * per-cell arrays of a solve are views into one reused buffer. Solves are synchronous and never
 * nest, so one buffer suffices; if one were ever borrowed twice, the second borrower simply gets
 * a fresh buffer. Nothing returned to a caller refers to it (results are copied out).
 */
let shared = new Float64Array(4096);
let borrowed = false;

export interface Scratch {
  store: Float64Array;
  release: () => void;
}

/** A zero-filled store of exactly `size` doubles; call `release` when the solve is done. */
export function borrowScratch(size: number): Scratch {
  if (borrowed) return { store: new Float64Array(size), release: releaseNothing };
  if (shared.length < size) shared = new Float64Array(Math.max(size, 2 * shared.length));
  borrowed = true;
  const store = shared.subarray(0, size);
  store.fill(0);
  return { store, release: releaseShared };
}

// Module functions rather than closures made per borrow: nothing to capture, nothing to allocate.
function releaseShared(): void {
  borrowed = false;
}

function releaseNothing(): void {}
