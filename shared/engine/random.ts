/**
 * Seeded pseudo-random numbers for the engine (Monte Carlo draws, property
 * tests). The engine never calls Math.random: the same seed gives the same
 * sequence on the client and on the server.
 *
 * Generator: sfc32, Chris Doty-Humphrey's "Small Fast Counting" generator from
 * the PractRand test suite: three 32-bit words and a counter; each step returns
 * t = a + b + counter, then a = b ^ (b >>> 9), b = c + (c << 3),
 * c = rotl(c, 21) + t, counter += 1. Worst-case period 2^32 (the counter),
 * expected about 2^127. Read in the Rand project's rand_sfc crate (docs.rs:
 * crate description and src/sfc32.rs, constants BARREL_SHIFT 21, RSHIFT 9,
 * LSHIFT 3, counter increment 1, "derived ultimately from PractRand"); the
 * sfc-prng crate's documentation gives the same periods. NumPy's SFC64 is the
 * 64-bit member of the family (there named "Small Fast Chaotic").
 * Seeding: the 32-bit seed is expanded by splitmix32 — the SplitMix
 * construction of Steele, Lea & Flood ("Fast splittable pseudorandom number
 * generators", OOPSLA '14, ACM 2014, pp. 453–472, doi 10.1145/2660193.2660195;
 * citation read in the splitmix package documentation): a Weyl sequence with
 * the odd 32-bit golden-ratio increment 0x9e3779b9 (⌊2^32/φ⌋, arithmetic), each
 * value passed through MurmurHash3's 32-bit finaliser (xor-shift 16, × 0x85ebca6b,
 * xor-shift 13, × 0xc2b2ae35, xor-shift 16; read on its author's smhasher wiki
 * page "MurmurHash3"), in place of the paper's 64-bit mix function — so that
 * nearby seeds give unrelated streams. The tests check determinism, stream
 * independence and the uniform moments; no statistical test suite is run here.
 */

/** A seeded generator. `next()` returns a float uniformly in [0, 1). */
export interface SeededRandom {
  next(): number;
  /** Uniform in [lo, hi). */
  uniform(lo: number, hi: number): number;
  /** The internal state, to resume a stream (chunked Monte Carlo). */
  state(): [number, number, number, number];
}

function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

/**
 * Create a generator from an integer seed (any finite number; it is reduced
 * to 32 bits), or from a saved state.
 * Source: sfc32 (Doty-Humphrey, PractRand) seeded by splitmix32 (after
 * Steele, Lea & Flood, OOPSLA '14) — see the module comment for where each
 * was read.
 * Validity: Monte Carlo sampling; not for cryptographic use.
 * @param seed  integer seed [–] (reduced to 32 bits), or a saved state of four 32-bit words [–]
 * @returns the seeded generator
 */
export function createRandom(seed: number | [number, number, number, number]): SeededRandom {
  let a: number, b: number, c: number, d: number;
  if (Array.isArray(seed)) {
    [a, b, c, d] = seed.map((v) => v >>> 0) as [number, number, number, number];
  } else {
    if (!Number.isFinite(seed)) throw new RangeError('seed must be a finite number');
    const mix = splitmix32(Math.trunc(seed) >>> 0);
    a = mix();
    b = mix();
    c = mix();
    d = mix();
    // Warm up so the first outputs are well mixed.
    for (let i = 0; i < 12; i++) step();
  }
  function step(): number {
    a >>>= 0;
    b >>>= 0;
    c >>>= 0;
    d >>>= 0;
    const t = (((a + b) >>> 0) + d) >>> 0;
    d = (d + 1) >>> 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) >>> 0;
    c = ((c << 21) | (c >>> 11)) >>> 0;
    c = (c + t) >>> 0;
    return t >>> 0;
  }
  return {
    next: () => step() / 4294967296,
    uniform(lo: number, hi: number) {
      return lo + (hi - lo) * (step() / 4294967296);
    },
    state: () => [a >>> 0, b >>> 0, c >>> 0, d >>> 0],
  };
}

/**
 * The generator of one numbered stream of a seed: an sfc32 state whose first two words come
 * from the seed's splitmix32 sequence and whose last two come from the stream number's own
 * splitmix32 sequence (started from the stream number mixed with the seed's third word), then
 * warmed up like createRandom. So stream k of a seed is the same whatever computes it, in
 * whatever order, and different stream numbers give different states (streams for parallel
 * Monte Carlo blocks). Not the same numbers as createRandom(seed).
 * Source: sfc32 (Doty-Humphrey, PractRand) seeded by splitmix32 (after Steele, Lea & Flood,
 * OOPSLA '14; seeding separate streams from a counter is the splittable use of SplitMix) —
 * the module comment says where each was read; that the paper describes this use is recalled,
 * not read; the tests check that streams differ and are uncorrelated, not more.
 * Validity: Monte Carlo sampling; not for cryptographic use.
 * @param seed    integer seed [–] (reduced to 32 bits)
 * @param stream  stream number [–], an integer in 0..2^32 − 1
 * @returns the seeded generator of that stream
 */
export function createStreamRandom(seed: number, stream: number): SeededRandom {
  if (!Number.isFinite(seed)) throw new RangeError('seed must be a finite number');
  if (!Number.isInteger(stream) || stream < 0 || stream > 0xffffffff)
    throw new RangeError('stream must be an integer in 0..2^32 - 1');
  const ofSeed = splitmix32(Math.trunc(seed) >>> 0);
  const a = ofSeed();
  const b = ofSeed();
  const ofStream = splitmix32((stream ^ ofSeed()) >>> 0);
  const c = ofStream();
  const d = ofStream();
  const rng = createRandom([a, b, c, d]);
  for (let i = 0; i < 12; i++) rng.next();
  return rng;
}
