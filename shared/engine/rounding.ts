/** Decimals kept at the API edge, by field name; the engine keeps full precision inside. Order matters: first match wins. */
const rules: ReadonlyArray<readonly [test: (key: string) => boolean, decimals: number]> = [
  [(k) => k === 'kgfPerMm', 3],
  [(k) => k === 'lbfPerIn', 2],
  [(k) => k.endsWith('NPerMm') || k === 'nPerMm', 2],
  [(k) => k.endsWith('Mm'), 2],
  [(k) => k.endsWith('MPa'), 1],
  [(k) => /[a-z]N$/.test(k), 1],
  [(k) => k === 'adjusterTurns' || k.endsWith('Coils'), 2],
  [(k) => k.endsWith('Kg'), 2],
  [(k) => k.endsWith('Factor') || k === 'springIndex' || k === 'ratio', 3],
];

/**
 * Decimals an answer field is rounded to: lengths and sags 0.01 mm, rates 0.01 N/mm (0.001 kgf/mm, 0.01 lbf/in),
 * forces 0.1 N, turns 0.01, stresses 0.1 MPa, masses 0.01 kg, dimensionless factors 0.001; undefined for any other field.
 * @example decimalsFor('riderSagMm') // 2
 */
export function decimalsFor(key: string): number | undefined {
  for (const [test, decimals] of rules) if (test(key)) return decimals;
  return undefined;
}

function roundTo(x: number, decimals: number): number {
  const f = 10 ** decimals;
  const r = Math.round(x * f) / f;
  // No "-0" on the wire.
  return r === 0 ? 0 : r;
}

function walk(value: unknown, decimals: number | undefined): unknown {
  if (typeof value === 'number') return decimals === undefined || !Number.isFinite(value) ? value : roundTo(value, decimals);
  if (Array.isArray(value)) return value.map((v) => walk(v, decimals));
  if (typeof value !== 'object' || value === null) return value;
  const out: Record<string, unknown> = {};
  // A field without a rule of its own (min, max, down, up) takes its parent's.
  for (const [k, v] of Object.entries(value)) out[k] = walk(v, decimalsFor(k) ?? decimals);
  return out;
}

/**
 * Rounds every number of an answer by its field name (see `decimalsFor`), for people to read; used at the API edge by
 * the calculations, the recommendations and the sag check. Returns a new value; keys keep their order.
 * @example roundAnswer({ requiredRate: { nPerMm: 17.899999999999977, kgfPerMm: 1.825209, lbfPerIn: 102.2 } })
 * // { requiredRate: { nPerMm: 17.9, kgfPerMm: 1.825, lbfPerIn: 102.2 } }
 */
export function roundAnswer<T>(value: T): T {
  return walk(value, undefined) as T;
}
