/**
 * Running a child process for the long fuzz run: output collected, a timeout that kills it (by its own pid), and
 * its resident memory sampled from /proc/<pid>/status (VmRSS; worker threads share the process, so this is all
 * of it). On systems without /proc the peak stays 0.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';

/** Resident set size of a process in MB, or 0 when it cannot be read. */
export function residentMb(pid: number | undefined): number {
  if (pid === undefined) return 0;
  try {
    const m = /VmRSS:\s+(\d+)\s+kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) / 1024 : 0;
  } catch {
    return 0;
  }
}

/** Samples a process's memory every `everyMs` and keeps the peak. */
export class MemoryWatch {
  peakMb = 0;
  lastMb = 0;
  private readonly timer: NodeJS.Timeout;

  constructor(private readonly child: ChildProcess, everyMs = 100) {
    this.timer = setInterval(() => this.sample(), everyMs);
    this.timer.unref();
  }

  sample(): void {
    const mb = residentMb(this.child.pid);
    if (mb > 0) this.lastMb = mb;
    if (mb > this.peakMb) this.peakMb = mb;
  }

  stop(): void {
    clearInterval(this.timer);
  }
}

export interface RunResult {
  readonly code: number | null;
  readonly signal: NodeJS.Signals | null;
  readonly stdout: string;
  readonly stderr: string;
  readonly timedOut: boolean;
  readonly peakMb: number;
  readonly ms: number;
}

export function runProcess(command: string, args: readonly string[], cwd: string, timeoutMs: number): Promise<RunResult> {
  return new Promise((resolve) => {
    const started = performance.now();
    const child = spawn(command, args, { cwd, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, NO_COLOR: '1' } });
    const watch = new MemoryWatch(child, 50);
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    let timedOut = false;
    child.stdout!.on('data', (d: Buffer) => out.push(d));
    child.stderr!.on('data', (d: Buffer) => err.push(d));
    const timer = setTimeout(() => {
      timedOut = true;
      child.kill('SIGKILL');
    }, timeoutMs);
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      watch.stop();
      resolve({
        code, signal, timedOut, peakMb: watch.peakMb, ms: performance.now() - started,
        stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8'),
      });
    });
  });
}
