import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';

export interface Measured {
  label: string;
  requestsPerSec: number;
  p50Ms: number;
  p99Ms: number;
  non2xx: number;
  errors: number;
}

/** Starts a bench server script in its own process, so the load generator does not share its event loop. */
export async function startServer(script: string, env: Record<string, string> = {}): Promise<{ ports: Record<string, number>; child: ChildProcess }> {
  const child = spawn('npx', ['tsx', '--tsconfig', 'tsconfig.server.json', script], {
    env: { ...process.env, NODE_ENV: 'production', LOG_LEVEL: 'silent', JWT_SECRET: 'bench-secret-bench-secret-bench-secret-00', ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const lines = createInterface({ input: child.stdout! });
  const ports = await new Promise<Record<string, number>>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${script} did not start within 60 s`)), 60_000);
    lines.on('line', (line) => {
      // The server script announces its ports as one JSON line.
      if (line.startsWith('{"ports"')) {
        clearTimeout(timer);
        resolve((JSON.parse(line) as { ports: Record<string, number> }).ports);
      }
    });
    child.once('exit', (code) => reject(new Error(`${script} exited with ${code}`)));
  });
  return { ports, child };
}

/** One bounded autocannon run against 127.0.0.1 only. */
export async function measure(label: string, url: string, body: unknown, opts: { connections: number; durationSec: number }): Promise<Measured> {
  if (!url.startsWith('http://127.0.0.1:')) throw new Error('benchmarks only target loopback');
  const result = await autocannon({
    url,
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(body),
    connections: opts.connections,
    duration: opts.durationSec,
  });
  return {
    label,
    requestsPerSec: result.requests.average,
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors,
  };
}

export function report(baseline: Measured, subject: Measured, targets: { ratio: number; p99Ms: number }): void {
  const ratio = subject.requestsPerSec / baseline.requestsPerSec;
  const row = (m: Measured) =>
    `${m.label.padEnd(34)} ${m.requestsPerSec.toFixed(0).padStart(8)} req/s   p50 ${m.p50Ms.toFixed(1).padStart(5)} ms   p99 ${m.p99Ms.toFixed(1).padStart(5)} ms   non-2xx ${m.non2xx}   errors ${m.errors}`;
  console.log(row(baseline));
  console.log(row(subject));
  console.log(`ratio ${ratio.toFixed(3)} (target ≥ ${targets.ratio})   p99 ${subject.p99Ms.toFixed(1)} ms (target < ${targets.p99Ms} ms)`);
  console.log(ratio >= targets.ratio && subject.p99Ms < targets.p99Ms ? 'targets met' : 'TARGETS MISSED');
}
