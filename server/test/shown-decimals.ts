import { expect } from 'vitest';

// The decimals each field is shown with at the API edge, written out here from the product rule (not read from the
// rounding code): 0.01 mm, 0.01 N/mm, 0.001 kgf/mm, 0.01 lbf/in, 0.1 N, 0.01 turns, 0.1 MPa, 0.01 kg, 0.001 for factors.
/** Walks an answer and checks each number has at most the decimals its field is shown with. */
export function expectShownDecimals(value: unknown, path = '', inherited?: number): void {
  const rules: [RegExp, number][] = [[/^kgfPerMm$/, 3], [/^lbfPerIn$/, 2], [/(NPerMm|^nPerMm)$/, 2], [/Mm$/, 2], [/MPa$/, 1], [/[a-z]N$/, 1], [/^adjusterTurns$|Coils$/, 2], [/Kg$/, 2], [/Factor$|^springIndex$/, 3]];
  if (typeof value === 'number') {
    const decimals = (String(value).split('.')[1] ?? '').length;
    // A number with no rule must be whole (ids, counts, cents).
    expect(decimals, path).toBeLessThanOrEqual(inherited ?? 0);
    return;
  }
  if (Array.isArray(value)) return value.forEach((v, i) => expectShownDecimals(v, `${path}.${i}`, inherited));
  if (typeof value !== 'object' || value === null) return;
  for (const [k, v] of Object.entries(value)) expectShownDecimals(v, `${path}.${k}`, rules.find(([re]) => re.test(k))?.[1] ?? inherited);
}

