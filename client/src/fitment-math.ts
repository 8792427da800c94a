type N = number | null;

/**
 * Sprung masses from wet mass, static front share and unsprung masses, kg; null until all four are numbers.
 * Same formula as the contract's `sprungFromWet`, which sits in a module the client bundle must not load.
 */
export function sprungFromWetMass(d: { wetMassKg: N; frontStaticSharePct: N; frontUnsprungMassKg: N; rearUnsprungMassKg: N }) {
  const { wetMassKg: w, frontStaticSharePct: s, frontUnsprungMassKg: fu, rearUnsprungMassKg: ru } = d;
  if (![w, s, fu, ru].every((v) => typeof v === 'number' && Number.isFinite(v))) return null;
  return {
    frontSprungMassKg: ((w as number) * (s as number)) / 100 - (fu as number),
    rearSprungMassKg: ((w as number) * (100 - (s as number))) / 100 - (ru as number),
  };
}
