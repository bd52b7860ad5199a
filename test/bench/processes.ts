import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

export const BIN = fileURLToPath(new URL('../../src/cli/bin.mjs', import.meta.url));

/** Peak resident memory of a running process so far (VmHWM), in MB; null once it has gone. */
function peakRssMb(pid: number): number | null {
  try {
    const match = readFileSync(`/proc/${pid}/status`, 'utf8').match(/VmHWM:\s+(\d+) kB/);
    return match ? Number(match[1]) / 1024 : null;
  } catch {
    return null;
  }
}

/** Runs a command to its end: wall time, exit code, output, and peak resident memory (sampled from /proc). */
export function runMeasured(args: string[], env: Record<string, string>): Promise<{ ms: number; code: number | null; output: string; peakRssMb: number }> {
  return new Promise((resolve) => {
    const t0 = performance.now();
    const child = spawn(process.execPath, args, { env: { ...process.env, ...env } });
    let output = '';
    let peak = 0;
    child.stdout.on('data', (d) => (output += d));
    child.stderr.on('data', (d) => (output += d));
    const timer = setInterval(() => (peak = Math.max(peak, peakRssMb(child.pid!) ?? 0)), 100);
    child.on('exit', (code) => {
      clearInterval(timer);
      resolve({ ms: performance.now() - t0, code, output, peakRssMb: peak });
    });
  });
}

/** Starts a server process and resolves with its URL once it prints a line matching `ready`. */
export function startServerProcess(args: string[], env: Record<string, string>, ready: RegExp): Promise<{ url: string; child: ChildProcess; stop: () => Promise<void> }> {
  const child = spawn(process.execPath, args, { env: { ...process.env, ...env } });
  let output = '';
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start in 60 s:\n${output}`)), 60_000);
    const onData = (d: Buffer) => {
      output += d;
      const match = output.match(ready);
      if (!match) return;
      clearTimeout(timer);
      child.stdout!.off('data', onData);
      resolve({
        url: match[1],
        child,
        stop: () => new Promise((done) => {
          child.once('exit', () => done());
          child.kill('SIGTERM');
        }),
      });
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (d) => (output += d));
    child.on('exit', (code) => reject(new Error(`server exited with ${code}:\n${output}`)));
  });
}

export interface LoadResult {
  requests: number;
  errors: number;
  rps: number;
  p50: number;
  p99: number;
}

/** GET `url` from `connections` keep-alive connections for `durationMs` (after a short warm-up), on a worker thread; back to back, or `rate` requests a second in all. */
export function loadTest(url: string, options: { connections: number; durationMs: number; headers?: Record<string, string>; rate?: number }): Promise<LoadResult> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(new URL('./load-client.mjs', import.meta.url), { workerData: { url, connections: options.connections, durationMs: options.durationMs, headers: options.headers ?? {}, rate: options.rate ?? 0 } });
    worker.once('message', resolve);
    worker.once('error', reject);
  });
}
