// The project's one source of randomness, and the one range of seeds.
export { MAX_SEED, checkSeed } from "./seed.js";
export * from "./prng.js";
