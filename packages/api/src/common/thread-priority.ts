import { readdirSync } from 'node:fs';
import { getPriority, setPriority } from 'node:os';

/** How often threads started since the last look are found. */
const LOOK_EVERY_MS = 2_000;

/**
 * Lets the event loop run before the process's helper threads when they compete for the
 * processor. Every request waits on the event loop; the helpers (libuv's pool running SQLite,
 * sharp and file syncs, libvips', the worker pool's, V8's compilers and collectors) do work a
 * request waits for only at its end. The kernel shares the processor among runnable threads as
 * equals, so on two cores at 150 requests a second the loop stood waiting to run for 150–370 ms
 * of every second while those ran. Linux keeps a nice value per thread, and any thread may be
 * made nicer without privilege: every thread but the event loop's is set to `niceness`.
 *
 * Threads start later too (libuv's pool at its first task, libvips' when a photo is decoded);
 * one started by a helper inherits its niceness, and the rest are found at the next look.
 * Looks again every `everyMs`; returns a function that stops looking. Elsewhere than Linux,
 * or with `niceness` 0, it does nothing.
 */
export function lowerHelperThreads(niceness: number, everyMs = LOOK_EVERY_MS): () => void {
  if (process.platform !== 'linux' || niceness <= 0) return () => undefined;
  const look = () => {
    let threads: string[];
    try {
      threads = readdirSync('/proc/self/task');
    } catch {
      return;
    }
    for (const name of threads) {
      const tid = Number(name);
      // The main thread's id is the process's: that is the event loop.
      if (tid === process.pid) continue;
      try {
        if (getPriority(tid) < niceness) setPriority(tid, niceness);
      } catch {
        // A thread that ended since the listing.
      }
    }
  };
  look();
  const timer = setInterval(look, everyMs);
  timer.unref();
  return () => clearInterval(timer);
}
