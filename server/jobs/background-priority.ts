import { readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';

/** WARPMETER_WORKER_NICE: a whole number from 0 (normal priority) to 19; anything else is refused with a message. */
export function parseWorkerNice(raw: string | undefined): number {
  if (raw === undefined || raw === '') return 19;
  if (!/^\d{1,2}$/.test(raw.trim()) || Number(raw) > 19) {
    throw new Error(`WARPMETER_WORKER_NICE must be a whole number from 0 (normal priority) to 19 (lowest), not "${raw}".`);
  }
  return Number(raw);
}

/** True when this process leads its own session (Linux: field 6 of /proc/self/stat is the session id). */
function leadsOwnSession(): boolean {
  try {
    const fields = readFileSync('/proc/self/stat', 'utf8').split(') ')[1].split(' ');
    return Number(fields[3]) === process.pid;
  } catch {
    return false;
  }
}

/**
 * Puts this process in the background for the CPU scheduler. On Linux with scheduler autogroups
 * (`kernel.sched_autogroup_enabled` = 1, the default on most distributions) the kernel first
 * shares the CPU between sessions, and a nice value only weighs against processes of the same
 * session (sched(7), "The autogroup feature"): so a worker that leads its own session (started by
 * a service manager, or detached) sets its session's autogroup nice. A worker sharing a session
 * — e.g. `npm run worker` in a terminal — must not lower the others in it, so it lowers only its
 * own main thread (its pool threads already run at nice 19). Best effort; returns what it did.
 */
export function lowerSessionPriority(nice = 19): 'session' | 'thread' | 'none' {
  if (leadsOwnSession()) {
    try {
      // The kernel shows the line only while an autogroup schedules this process: not when
      // autogroups are off, nor inside a cgroup of its own (a container), where its nice would
      // be accepted and change nothing.
      if (/^\/autogroup-\d+ nice/.test(readFileSync('/proc/self/autogroup', 'utf8'))) {
        writeFileSync('/proc/self/autogroup', String(nice));
        return 'session';
      }
    } catch {
      // no autogroups here
    }
  }
  // Otherwise this thread's own nice value.
  try {
    os.setPriority(0, nice);
    return 'thread';
  } catch {
    return 'none';
  }
}
