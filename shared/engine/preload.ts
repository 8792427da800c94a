import type { ForkSpacerInput, InstalledLengthWindow, PreloadRange } from './types';

/** How an end states its preload: a fixed range, or the installed-length window the adjuster sets. */
export interface PreloadSetting {
  preloadRangeMm?: PreloadRange;
  adjusterInstalledLengthMm?: InstalledLengthWindow;
}

/** One spring's preload range and the preload it has with the adjuster fully out (where turns are counted from). */
export interface SpringPreload {
  range: PreloadRange;
  fullyOutMm: number;
}

/**
 * A spring's preload range. With an installed-length window the adjuster sets the installed length, so the preload
 * is the free length less it: from free − window.max (fully out) to free − window.min (fully in). A spring shorter
 * than the window would rattle, so the range starts at 0 and turns still count from the fully-out position.
 * @example springPreload({ adjusterInstalledLengthMm: { min: 154, max: 168 } }, 180) // { range: { min: 12, max: 26 }, fullyOutMm: 12 }
 */
export function springPreload(setting: PreloadSetting, freeLengthMm: number): SpringPreload {
  const w = setting.adjusterInstalledLengthMm;
  if (w !== undefined) {
    const fullyOutMm = freeLengthMm - w.max;
    return { range: { min: Math.max(0, fullyOutMm), max: Math.max(0, freeLengthMm - w.min) }, fullyOutMm };
  }
  const range = setting.preloadRangeMm;
  if (range === undefined) throw new RangeError('Give either the preload range or the adjuster’s installed-length window');
  return { range, fullyOutMm: range.min };
}

/**
 * The preload range the rate band is worked out for: the fixed range, or the window applied to `bandFreeLengthMm`;
 * undefined when the range depends on a free length that is not given.
 * @example bandPreloadRange({ adjusterInstalledLengthMm: { min: 154, max: 168 } }, 170) // { min: 2, max: 16 }
 */
export function bandPreloadRange(setting: PreloadSetting, bandFreeLengthMm?: number): PreloadRange | undefined {
  if (setting.adjusterInstalledLengthMm === undefined) return setting.preloadRangeMm;
  return bandFreeLengthMm === undefined ? undefined : springPreload(setting, bandFreeLengthMm).range;
}

/**
 * Adjuster turns from the fully-out position: (preload set − preload fully out) ÷ pitch.
 * @example adjusterTurnsFromFullyOut(10, 2, 1.5) // 5.333...
 */
export function adjusterTurnsFromFullyOut(preloadMm: number, fullyOutMm: number, pitchMm: number): number {
  return (preloadMm - fullyOutMm) / pitchMm;
}

/**
 * Spacer length for a new fork spring without an adjuster: stock spacer + (stock free − new free) + (new preload − stock
 * preload), so a shorter spring gets a longer spacer and more preload a longer one still.
 * @example forkSpacerLength({ stockSpacerMm: 100, stockFreeLengthMm: 300, stockPreloadMm: 10 }, 290, 15) // 115
 */
export function forkSpacerLength(spacer: ForkSpacerInput, freeLengthMm: number, preloadMm: number): number {
  return spacer.stockSpacerMm + (spacer.stockFreeLengthMm - freeLengthMm) + (preloadMm - spacer.stockPreloadMm);
}
