import { readdirSync, readFileSync } from 'node:fs';

/** Each thread's nice value in a process, from the kernel's own account (proc(5): stat field 19). */
export function niceByThread(pid: number | 'self' = 'self'): Map<number, number> {
  const out = new Map<number, number>();
  for (const name of readdirSync(`/proc/${pid}/task`)) {
    try {
      const stat = readFileSync(`/proc/${pid}/task/${name}/stat`, 'utf8');
      // The command name may hold spaces: the fields after it start at state (field 3).
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      out.set(Number(name), Number(fields[16]));
    } catch {
      // Ended since the listing.
    }
  }
  return out;
}
