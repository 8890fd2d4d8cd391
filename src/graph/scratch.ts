// Reusable scratch arrays for the searches that run many times on tiny graphs (a sweep of 10^5
// small graphs): allocating a handful of small typed arrays per call makes the garbage collector
// the largest single cost. Common practice, no source.

/** Longest array a pool keeps; longer requests get a fresh array each time. */
export const SCRATCH_MAX_LENGTH = 256;

/**
 * One reusable typed array per length (up to SCRATCH_MAX_LENGTH) for one role in one module.
 * The array comes back with whatever the previous call left in it: callers must write every
 * entry they read before reading it, must not keep it after returning, and must not hand it to
 * code that could take the same pool (each role in a function gets a pool of its own).
 * Module state is per thread, so workers do not share pools.
 */
export class ScratchPool<T extends Int32Array | Uint8Array | Float64Array> {
  private readonly byLength: (T | undefined)[] = [];
  constructor(private readonly make: (length: number) => T) {}

  take(length: number): T {
    if (length > SCRATCH_MAX_LENGTH) return this.make(length);
    let a = this.byLength[length];
    if (a === undefined) {
      a = this.make(length);
      this.byLength[length] = a;
    }
    return a;
  }
}

export const int32Pool = (): ScratchPool<Int32Array> => new ScratchPool((k) => new Int32Array(k));
export const uint8Pool = (): ScratchPool<Uint8Array> => new ScratchPool((k) => new Uint8Array(k));
export const float64Pool = (): ScratchPool<Float64Array> => new ScratchPool((k) => new Float64Array(k));
