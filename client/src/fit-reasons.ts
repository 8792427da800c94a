import type { FitmentDto, SpringFitDto } from '@shared/catalogue';
import { springFitToleranceMm } from '@shared/catalogue/constants';
import { formatNumber } from './format';

export interface FitReason {
  ok: boolean;
  text: string;
}

type Window = Pick<
  FitmentDto,
  | 'forkSpringInnerDiameterMm'
  | 'forkSpringFreeLengthMinMm'
  | 'forkSpringFreeLengthMaxMm'
  | 'shockSpringInnerDiameterMm'
  | 'shockSpringFreeLengthMinMm'
  | 'shockSpringFreeLengthMaxMm'
>;

/** Why the fitment's window takes a spring or not, in the two checks the server's rule makes (diameter, free length). */
export function fitReasons(s: Pick<SpringFitDto, 'end' | 'innerDiameterMm' | 'freeLengthMm'>, f: Window): FitReason[] {
  const w =
    s.end === 'fork'
      ? { id: f.forkSpringInnerDiameterMm, min: f.forkSpringFreeLengthMinMm, max: f.forkSpringFreeLengthMaxMm }
      : { id: f.shockSpringInnerDiameterMm, min: f.shockSpringFreeLengthMinMm, max: f.shockSpringFreeLengthMaxMm };
  const mm = (v: number) => `${formatNumber(v, 1)} mm`;
  const idOk = Math.abs(s.innerDiameterMm - w.id) <= springFitToleranceMm;
  const lengthOk = s.freeLengthMm >= w.min && s.freeLengthMm <= w.max;
  return [
    {
      ok: idOk,
      text: `Inner diameter ${mm(s.innerDiameterMm)} ${idOk ? 'matches' : 'does not match'} the bike's ${mm(w.id)} (± ${formatNumber(springFitToleranceMm, 1)} mm)`,
    },
    { ok: lengthOk, text: `Free length ${mm(s.freeLengthMm)} is ${lengthOk ? 'inside' : 'outside'} ${formatNumber(w.min, 1)}–${mm(w.max)}` },
  ];
}
