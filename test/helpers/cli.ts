import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const BIN = fileURLToPath(new URL('../../src/cli/bin.mjs', import.meta.url));

/** Environment for a child CLI: the parent's, without variables that would change the database or port. */
export function cleanEnv(extra: Record<string, string | undefined> = {}): NodeJS.ProcessEnv {
  const env = { ...process.env };
  for (const key of ['DATABASE_URL', 'PLUMBLINE_DB', 'PORT', 'HOST', 'DEBUG']) delete env[key];
  for (const [k, v] of Object.entries(extra)) if (v === undefined) delete env[k]; else env[k] = v;
  return env;
}

/** Runs `plumbline ARGS` to completion. */
export function runCli(args: string[], options: { cwd?: string; env?: Record<string, string | undefined>; input?: string; uid?: number; gid?: number } = {}) {
  const run = spawnSync(process.execPath, [BIN, ...args], { cwd: options.cwd, env: cleanEnv(options.env), encoding: 'utf8', input: options.input, timeout: 60_000, uid: options.uid, gid: options.gid });
  return { code: run.status, stdout: run.stdout, stderr: run.stderr };
}

/** Starts `plumbline serve` and resolves once it prints its URL. */
export function startServe(options: { cwd: string; env?: Record<string, string | undefined> }): Promise<{ child: ChildProcess; url: string; output: () => string; startedInMs: number }> {
  const started = Date.now();
  const child = spawn(process.execPath, [BIN, 'serve'], { cwd: options.cwd, env: cleanEnv({ PORT: '0', ...options.env }) });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`serve did not start in 20 s:\n${out}`)), 20_000);
    child.stdout!.on('data', () => {
      const match = out.match(/serving (http:\/\/\S+?)\/? /);
      if (match && out.includes('Press Ctrl-C')) {
        clearTimeout(timer);
        resolve({ child, url: match[1], output: () => out, startedInMs: Date.now() - started });
      }
    });
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`serve exited with ${code}:\n${out}`));
    });
  });
}

export function stop(child: ChildProcess): Promise<number | null> {
  return new Promise((resolve) => {
    child.removeAllListeners('exit');
    child.on('exit', (code) => resolve(code));
    child.kill('SIGINT');
  });
}
