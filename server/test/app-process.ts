import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { projectRoot } from '../config';

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

/**
 * Starts another app server as production does (server/index.ts) in its own process, on any free port of
 * 127.0.0.1: its caches, limiters and module state are its own, as on a second machine.
 */
export function startServerProcess(env: Record<string, string>): Promise<RunningServer> {
  const child = spawn(join(projectRoot, 'node_modules/.bin/tsx'), ['--tsconfig', 'tsconfig.server.json', 'server/index.ts'], {
    cwd: projectRoot,
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: '0' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout.on('data', (c: Buffer) => (out += c.toString()));
  child.stderr.on('data', (c: Buffer) => (out += c.toString()));
  return new Promise((resolve, reject) => {
    const failed = (code: number | null) => reject(new Error(`the second app server exited with ${code}:\n${out}`));
    child.once('exit', failed);
    const seen = () => {
      const port = /serving on http:\/\/127\.0\.0\.1:(\d+)/.exec(out)?.[1];
      if (!port) return;
      child.stdout.off('data', seen);
      child.off('exit', failed);
      resolve({
        url: `http://127.0.0.1:${port}`,
        stop: () =>
          new Promise<void>((done) => {
            if (child.exitCode !== null) return done();
            child.once('exit', () => done());
            child.kill('SIGTERM');
          }),
      });
    };
    child.stdout.on('data', seen);
  });
}
