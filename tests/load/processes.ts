// Child processes and waits shared by the load and fault runs. Each child runs in its own process
// group, so stopping it stops everything it started (the app's workers included).
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

const ROOT = fileURLToPath(new URL('../..', import.meta.url));

/** scripts/db.sh with arguments, run from the project's root; its output, trimmed. */
export const db = (...args: string[]) =>
  execFileSync('bash', ['scripts/db.sh', ...args], { cwd: ROOT })
    .toString()
    .trim();

/** A new, empty scratch database of that name (the project's PostgreSQL started if needed); its URL. */
export function scratchDatabase(name: string): string {
  db('start');
  db('drop', name);
  db('create', name);
  return db('url', name);
}

/** Runs a command with its output kept back; if it fails, the error carries the last 40 lines. */
export function runQuiet(command: string, args: string[], env: NodeJS.ProcessEnv): void {
  try {
    execFileSync(command, args, { env, stdio: ['ignore', 'pipe', 'pipe'], maxBuffer: 64 * 2 ** 20 });
  } catch (err) {
    const e = err as { stdout?: Buffer; stderr?: Buffer };
    const tail = `${e.stdout?.toString() ?? ''}\n${e.stderr?.toString() ?? ''}`.trim().split('\n').slice(-40);
    throw new Error(`${command} ${args.join(' ')} failed:\n${tail.join('\n')}`);
  }
}

const children = new Set<ChildProcess>();

/** `node <args>` in a process group of its own, remembered until it exits. */
export function startChild(args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  const child = spawn('node', args, { env, detached: true, stdio: 'ignore' });
  children.add(child);
  child.once('exit', () => children.delete(child));
  return child;
}

export function signalGroup(child: ChildProcess, signal: NodeJS.Signals): void {
  try {
    process.kill(-child.pid!, signal);
  } catch {
    // already gone
  }
}

const running = (child: ChildProcess) => child.exitCode === null && child.signalCode === null;

/** Stops a child's process group and waits until it has exited (SIGKILL after 5 s). */
export async function stopAndWait(child: ChildProcess): Promise<void> {
  if (!running(child)) return;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  signalGroup(child, 'SIGTERM');
  const timer = setTimeout(() => signalGroup(child, 'SIGKILL'), 5_000);
  await exited;
  clearTimeout(timer);
}

/** Stops every child still running: SIGTERM to each group, SIGKILL to what is left after 5 s. */
export async function stopChildren(): Promise<void> {
  const all = [...children];
  all.forEach((c) => signalGroup(c, 'SIGTERM'));
  for (let i = 0; i < 50 && all.some(running); i++) await sleep(100);
  all.forEach((c) => signalGroup(c, 'SIGKILL'));
  children.clear();
}

/** Waits until `url` answers below 500, for at most `seconds`. */
export async function waitFor(url: string, seconds: number): Promise<void> {
  for (let i = 0; i < seconds * 4; i++) {
    if (
      await fetch(url).then(
        (r) => r.status < 500,
        () => false,
      )
    )
      return;
    await sleep(250);
  }
  throw new Error(`${url} did not come up within ${seconds} s`);
}
