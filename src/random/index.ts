export * from "./prng.js";
