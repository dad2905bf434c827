import { writeFileSync } from 'node:fs';

/**
 * Puts this whole process in the background for the CPU scheduler: the nice value of its
 * scheduling autogroup (Linux, when `kernel.sched_autogroup_enabled` is 1, the default on most
 * distributions) set to 19. With autogroups the kernel first shares the CPU between sessions,
 * and a process's own nice value only weighs against processes of the same session (sched(7),
 * "The autogroup feature") — so `nice npm run worker` started from another terminal, or detached
 * by a service manager, would still take a full share from the web server. Best effort: false
 * where there is no autogroup or it may not be changed.
 */
export function lowerSessionPriority(nice = 19): boolean {
  try {
    writeFileSync('/proc/self/autogroup', String(nice));
    return true;
  } catch {
    return false;
  }
}
