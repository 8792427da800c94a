/** CPU time of processes by pid, from /proc (Linux): what each part of a benchmark costs, not only how long it took. */
import { readFileSync, readdirSync } from 'node:fs';

const tick = 100; // USER_HZ on Linux, in clock ticks per second

/** User + system CPU of one process so far, in ms; 0 once it is gone. */
export function cpuMsOf(pid: number): number {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // Fields 14 and 15 (utime, stime) counted from 1, after pid and comm.
    return ((Number(f[11]) + Number(f[12])) * 1000) / tick;
  } catch {
    return 0;
  }
}

/** A process and every process below it (tsx starts node under it; the database's backends sit under its postmaster). */
export function treeOf(root: number): number[] {
  const parent = new Map<number, number>();
  for (const d of readdirSync('/proc')) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const stat = readFileSync(`/proc/${d}/stat`, 'utf8');
      parent.set(Number(d), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      /* gone meanwhile */
    }
  }
  const out = [root];
  for (let i = 0; i < out.length; i++) for (const [pid, ppid] of parent) if (ppid === out[i]) out.push(pid);
  return out;
}

/** CPU of one process tree (all of it) or of one process alone. */
export const treeCpu = (pid: number) => () => treeOf(pid).reduce((s, p) => s + cpuMsOf(p), 0);
export const selfCpu = (pid: number) => () => cpuMsOf(pid);

/** CPU spent by each named part between now and each read, in ms. */
export function cpuMeter(parts: Record<string, () => number>): { read(): Record<string, number> } {
  const take = () => Object.fromEntries(Object.entries(parts).map(([k, f]) => [k, f()]));
  const before = take();
  return { read: () => Object.fromEntries(Object.entries(take()).map(([k, v]) => [k, v - before[k]!])) };
}
