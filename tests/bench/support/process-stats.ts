/**
 * What the benches read of this machine (Linux /proc) and how they summarise
 * alternating rounds. Not a bench itself: `npm run bench` runs only files
 * named *.bench.ts.
 */
import fs from 'node:fs';

/** Clock ticks per second of /proc's CPU times (USER_HZ, 100 on Linux). */
const TICKS_PER_SECOND = 100;

/** Median of a list (the mean of the middle two for an even count). */
export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

/**
 * A process's parent and CPU time, or null once it has ended.
 * @returns cpuMs: user + system of all its threads; reapedMs: that of its ended children it has waited for
 *   (how PostgreSQL's exited backends stay counted, through the postmaster)
 */
export function processStat(pid: number | undefined): { parent: number; cpuMs: number; reapedMs: number } | null {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // after the command: [1] parent pid, [11] utime, [12] stime, [13] cutime, [14] cstime
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ').map(Number);
    const ms = (ticks: number) => (ticks * 1000) / TICKS_PER_SECOND;
    return { parent: fields[1], cpuMs: ms(fields[11] + fields[12]), reapedMs: ms(fields[13] + fields[14]) };
  } catch {
    return null;
  }
}

/** The running processes whose command line satisfies `match` (processes that end meanwhile are skipped). */
export function processesWhere(match: (cmdline: string) => boolean): number[] {
  const pids: number[] = [];
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      if (match(fs.readFileSync(`/proc/${entry}/cmdline`, 'utf8'))) pids.push(Number(entry));
    } catch {
      // the process ended meanwhile
    }
  }
  return pids;
}

/** CPU milliseconds the whole machine has spent busy (/proc/stat: user, nice, system, irq, softirq, steal). */
export function machineBusyMs(): number {
  const fields = fs.readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
  const [user, nice, system, , , irq, softirq, steal] = fields;
  return ((user + nice + system + irq + softirq + steal) * 1000) / TICKS_PER_SECOND;
}
