import { describe, expect, it } from 'vitest';
import { Gate } from './gate';

describe('checkout gate', () => {
  it('never runs more than its size at once, and runs every caller in turn', async () => {
    const gate = new Gate(3);
    let now = 0;
    let most = 0;
    const done: number[] = [];
    await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        gate.run(async () => {
          now += 1;
          most = Math.max(most, now);
          await new Promise((r) => setTimeout(r, 2));
          now -= 1;
          done.push(i);
        }),
      ),
    );
    expect(most).toBe(3);
    expect(done.sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i));
  });

  it('a failing caller frees its place', async () => {
    const gate = new Gate(1);
    await expect(gate.run(async () => Promise.reject(new Error('no')))).rejects.toThrow('no');
    expect(await gate.run(async () => 'next')).toBe('next');
  });
});
