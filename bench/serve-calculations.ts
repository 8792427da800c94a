import type { AddressInfo } from 'node:net';
import { createApp } from '../server/app';
import { parseConfig } from '../server/config';
import { baselineApp } from './baseline-app';

// The rate limit is raised through its config value, as it would be for a trusted load test.
const config = parseConfig({ ...process.env, CALC_RATE_LIMIT_PER_MINUTE: '100000000' });
const app = createApp(config).listen(0, '127.0.0.1');
const base = baselineApp().listen(0, '127.0.0.1');
await Promise.all([app, base].map((s) => new Promise((r) => s.once('listening', r))));
console.log(JSON.stringify({ ports: { app: (app.address() as AddressInfo).port, baseline: (base.address() as AddressInfo).port } }));
