import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

export interface ChildServer {
  process: ChildProcess;
  origin: string;
  exited: Promise<number | null>;
  output: () => string;
}

/** Starts the real server (server/index.ts) as its own node process on a free port, as npm start
 * does, so that drills can send it signals. Resolves once it listens. */
export async function startChildServer(extraEnv: Record<string, string> = {}): Promise<ChildServer> {
  const root = path.resolve(import.meta.dirname, '../..');
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: { ...process.env, PORT: '0', NODE_ENV: 'test', ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let log = '';
  child.stdout!.on('data', (d) => (log += d));
  child.stderr!.on('data', (d) => (log += d));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  const origin = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${log}`)), 60_000);
    const watch = () => {
      const m = /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(log);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout!.on('data', watch);
    void exited.then(() => reject(new Error(`server exited early:\n${log}`)));
  });
  return { process: child, origin, exited, output: () => log };
}
