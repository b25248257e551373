import { spawn, type ChildProcess } from 'node:child_process';

/**
 * Starts a real render worker process (`scripts/worker.ts`) against the test
 * database and object store. Short queue timings let a killed worker's frame
 * come back quickly.
 */
export function startWorker(name: string, extraEnv: Record<string, string> = {}): ChildProcess & { output: string[] } {
  const child = spawn(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/worker.ts'], {
    env: { ...process.env, SKYWELL_WORKER_NAME: name, RENDER_THREADS: '1', QUEUE_MAINTENANCE_SECONDS: '1', RENDER_FRAME_TIMEOUT_SECONDS: '6', ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  }) as ChildProcess & { output: string[] };
  child.output = [];
  child.stdout!.on('data', (d: Buffer) => child.output.push(d.toString()));
  child.stderr!.on('data', (d: Buffer) => child.output.push(d.toString()));
  return child;
}

export async function stopWorker(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  child.kill(signal);
  await exited;
}

/** Polls until `check` returns a value other than undefined, or fails after the timeout. */
export async function waitFor<T>(what: string, check: () => Promise<T | undefined>, timeoutMs = 60_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const value = await check();
    if (value !== undefined) return value;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
}
