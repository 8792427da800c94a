import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { SPRING_END_TYPES } from '../../shared/engine';
import { luggageStations, loadStationKinds, springEndTypes } from '../../shared/catalogue/constants';

// Node I/O stays out of shared/, so this check of shared modules lives on the server side.
const here = join(dirname(fileURLToPath(import.meta.url)), '../../shared/catalogue');

/** Every bare package a module pulls in, following its relative imports (type-only imports are erased, so skipped). */
function packagesReachedFrom(file: string, seen = new Set<string>()): Set<string> {
  const out = new Set<string>();
  if (seen.has(file)) return out;
  seen.add(file);
  const source = readFileSync(file, 'utf8');
  for (const m of source.matchAll(/^\s*(import|export)\s+(type\s+)?[^'"]*?from\s+'([^']+)'/gm)) {
    if (m[2]) continue;
    const spec = m[3]!;
    if (!spec.startsWith('.')) out.add(spec);
    else for (const p of packagesReachedFrom(resolve(dirname(file), spec.endsWith('.ts') ? spec : `${spec}.ts`), seen)) out.add(p);
  }
  return out;
}

describe('the catalogue constants the client imports', () => {
  it('are the same end types the engine solves with, one list and not a copy', () => {
    expect(springEndTypes).toBe(SPRING_END_TYPES);
  });

  it('load without class-validator or class-transformer, and so do the fitment rules', () => {
    for (const module of ['constants.ts', 'fitment-rules.ts']) {
      const reached = [...packagesReachedFrom(join(here, module))];
      expect(reached.filter((p) => p.startsWith('class-')), module).toEqual([]);
    }
    // The walk does see decorators where they are, so the check above can fail.
    expect(packagesReachedFrom(join(here, 'common.ts'))).toContain('class-validator');
  });

  it('name the luggage stations as load stations', () => {
    for (const s of luggageStations) expect(loadStationKinds).toContain(s);
  });
});
