import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createShownBeacon } from './shown-beacon';

describe('the finder’s shown-answer beacon', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('reports a load once the rider pauses, not each keystroke on the way to it', () => {
    const send = vi.fn(async () => undefined);
    const beacon = createShownBeacon(send, 1_500);
    beacon.shown('rider 9', 'bike-1');
    vi.advanceTimersByTime(400);
    beacon.shown('rider 95', 'bike-1');
    vi.advanceTimersByTime(1_499);
    expect(send).not.toHaveBeenCalled();
    vi.advanceTimersByTime(1);
    expect(send.mock.calls).toEqual([['bike-1']]);
  });

  it('reports each load once, and none the server already answered', () => {
    const send = vi.fn(async () => undefined);
    const beacon = createShownBeacon(send, 1_000);
    beacon.shown('a', 'bike-1');
    vi.advanceTimersByTime(1_000);
    beacon.shown('a', 'bike-1');
    vi.advanceTimersByTime(5_000);
    beacon.servedByServer('b');
    beacon.shown('b', 'bike-1');
    vi.advanceTimersByTime(5_000);
    beacon.shown('c', 'bike-2');
    beacon.servedByServer('c');
    vi.advanceTimersByTime(5_000);
    expect(send).toHaveBeenCalledTimes(1);
  });

  it('reports at once when the rider acts on the answer before pausing, and only once', () => {
    const send = vi.fn(async () => undefined);
    const beacon = createShownBeacon(send, 1_500);
    beacon.shown('a', 'bike-1');
    beacon.flush();
    expect(send).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(5_000);
    beacon.flush();
    expect(send).toHaveBeenCalledTimes(1);
  });

  it('a failed report is not an error on the page', async () => {
    const beacon = createShownBeacon(() => Promise.reject(new Error('offline')), 10);
    beacon.shown('a', 'bike-1');
    expect(() => vi.advanceTimersByTime(10)).not.toThrow();
    await vi.runAllTimersAsync();
  });
});
