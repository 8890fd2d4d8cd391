// Sweeps on a Slurm cluster: run folders with an array job over the plan's shards and a dependent
// merge job, their status from the shard stores and squeue, resubmitting what died, merging.
export * from "./run.js";
export { arraySpec, mergeScript, runReadme, shellWord, submitScript } from "./scripts.js";
export { queuedJobs, type QueuedJob, type QueueView } from "./scheduler.js";
export * from "./runs.js";
