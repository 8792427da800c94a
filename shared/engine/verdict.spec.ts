import { describe, expect, it } from 'vitest';
import { judgeSpring, type SpringJudgeInput } from './verdict';

const base: SpringJudgeInput = {
  preloadNeededMm: 8,
  preloadRangeMm: { min: 2, max: 20 },
  settles: true,
  staticSagMm: 8,
  targets: { staticSagMm: 8, riderSagMm: 32 },
  staticSagToleranceMm: 3,
};

describe('one spring rule', () => {
  it('calls a spring ok when rider sag lands on target in range and static sag is within the tolerance', () => {
    expect(judgeSpring(base)).toEqual({ verdict: 'ok', reason: 'on-target' });
    expect(judgeSpring({ ...base, staticSagMm: 5 })).toEqual({ verdict: 'ok', reason: 'on-target' });
    expect(judgeSpring({ ...base, staticSagMm: 11 })).toEqual({ verdict: 'ok', reason: 'on-target' });
  });

  it('calls a spring that leaves too little static sag too soft, and too much too stiff', () => {
    expect(judgeSpring({ ...base, staticSagMm: 4.99 })).toEqual({ verdict: 'too-soft', reason: 'static-sag-low' });
    expect(judgeSpring({ ...base, staticSagMm: 11.01 })).toEqual({ verdict: 'too-stiff', reason: 'static-sag-high' });
  });

  it('judges static sag to the 0.01 mm it is shown with, so a figure read off the finder gets the same word back', () => {
    expect(judgeSpring({ ...base, staticSagMm: 4.996 }).verdict).toBe('ok');
    expect(judgeSpring({ ...base, staticSagMm: 11.004 }).verdict).toBe('ok');
    expect(judgeSpring({ ...base, staticSagMm: 11.005 }).verdict).toBe('too-stiff');
    expect(judgeSpring({ ...base, targets: { staticSagMm: 2, riderSagMm: 30 }, staticSagMm: 0.004 }).reason).toBe('topped-out');
  });

  it('judges the preload range before the sags', () => {
    expect(judgeSpring({ ...base, preloadNeededMm: 21 })).toEqual({ verdict: 'too-soft', reason: 'preload-above-range' });
    expect(judgeSpring({ ...base, preloadNeededMm: 1, staticSagMm: 20 })).toEqual({ verdict: 'too-stiff', reason: 'preload-below-range' });
  });

  it('without a known range (the sag check), judges the sags only', () => {
    const { preloadRangeMm: _r, ...noRange } = base;
    expect(judgeSpring({ ...noRange, preloadNeededMm: 500 })).toEqual({ verdict: 'ok', reason: 'on-target' });
  });

  it('calls a bike topped out on its own weight too soft even when the tolerance reaches 0', () => {
    expect(judgeSpring({ ...base, targets: { staticSagMm: 2, riderSagMm: 30 }, staticSagMm: 0 })).toEqual({ verdict: 'too-soft', reason: 'topped-out' });
  });

  it('calls a spring that does not come to rest on the rider-sag target too soft', () => {
    expect(judgeSpring({ ...base, settles: false })).toEqual({ verdict: 'too-soft', reason: 'does-not-settle' });
  });

  it('names coil bind only for a spring otherwise right', () => {
    expect(judgeSpring({ ...base, coilBindMarginMm: -1 })).toEqual({ verdict: 'coil-bind', reason: 'coil-bind' });
    expect(judgeSpring({ ...base, coilBindMarginMm: -1, staticSagMm: 2 }).verdict).toBe('too-soft');
    expect(judgeSpring({ ...base, coilBindMarginMm: 0 }).verdict).toBe('ok');
  });
});
