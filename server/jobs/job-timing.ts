/**
 * Lock and stall timings of audit workers. A worker renews its job's lock every lockDuration/2;
 * a worker that is killed stops renewing, and after the lock expires the next stalled-job check
 * (every stalledIntervalMs, on any live worker) moves the job back to the queue for another
 * worker. Short enough that a crash costs seconds, long enough that a busy but healthy worker —
 * whose event loop stays free because the maths runs on worker threads — never looks stalled.
 */
export interface JobTiming {
  lockDurationMs: number;
  stalledIntervalMs: number;
  /** How many times a job may be recovered from a dead worker before it is failed. */
  maxStalledCount: number;
}

const num = (v: string | undefined, d: number) => (v && Number(v) > 0 ? Number(v) : d);

export function jobTimingFromEnv(env: NodeJS.ProcessEnv = process.env): JobTiming {
  return {
    lockDurationMs: num(env.WARPMETER_JOB_LOCK_MS, 10_000),
    stalledIntervalMs: num(env.WARPMETER_JOB_STALL_CHECK_MS, 5_000),
    maxStalledCount: num(env.WARPMETER_JOB_MAX_STALLS, 3),
  };
}
