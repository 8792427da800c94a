// The demo fitments against the rules of thumb they were laid out by (seeds/README.md says where each comes from).
import { describe, expect, it } from 'vitest';
import type { FitmentInputDto } from '../shared/catalogue/fitment.dto';
import { fitmentProblems, fitmentWarnings, strokeUse } from '../shared/catalogue/fitment-rules';
import { loadSplit } from '../shared/engine/statics';
import fitments from './data/fitments.json' with { type: 'json' };
import products from './data/products.json' with { type: 'json' };

const all = fitments as unknown as FitmentInputDto[];
const name = (f: FitmentInputDto) => `${f.make} ${f.model} ${f.variant} ${f.yearFrom}`.replace(/\s+/g, ' ');
const styles = ['road', 'adventure', 'offRoad'] as const;
const station = (f: FitmentInputDto, s: string) => f.loadStations.find((x) => x.station === s);
const mmOf = (f: FitmentInputDto, end: 'front' | 'rear', v: number) => (f.sag[end].unit === 'pct' ? (v / 100) * (end === 'front' ? f.forkTravelMm : f.rearWheelTravelMm) : v);

describe('the demo fitments hold to the trade’s rules of thumb', () => {
  it('has twenty fitments', () => {
    expect(all).toHaveLength(20);
  });

  it('every fitment passes the shared consistency checks with nothing to look at twice', () => {
    for (const f of all) {
      expect(fitmentProblems(f), name(f)).toEqual({});
      expect(fitmentWarnings(f), name(f)).toEqual({});
    }
  });

  it('the leverage uses 85–101 % of the shock’s stroke at full wheel travel', () => {
    for (const f of all) {
      const use = strokeUse(f)!;
      expect(use.usedShare, name(f)).toBeGreaterThanOrEqual(0.85);
      expect(use.usedShare, name(f)).toBeLessThanOrEqual(1.01);
    }
  });

  it('a seated rider sits 55–62 % and a passenger 75–85 % of the wheelbase back from the front axle (common practice, from memory)', () => {
    for (const f of all) {
      const rider = station(f, 'rider')!.positionMm / f.wheelbaseMm;
      expect(rider, name(f)).toBeGreaterThanOrEqual(0.55);
      expect(rider, name(f)).toBeLessThanOrEqual(0.62);
      const pillion = station(f, 'passenger');
      if (!pillion) continue;
      expect(pillion.positionMm / f.wheelbaseMm, name(f)).toBeGreaterThanOrEqual(0.75);
      expect(pillion.positionMm / f.wheelbaseMm, name(f)).toBeLessThanOrEqual(0.85);
    }
    // The stations differ from bike to bike, not one figure copied across the table.
    expect(new Set(all.map((f) => station(f, 'rider')!.positionMm)).size).toBeGreaterThan(10);
  });

  it('rider sag is a quarter to a third of the travel, deepening from road to adventure to off-road riding (common practice)', () => {
    for (const f of all) {
      for (const end of ['front', 'rear'] as const) {
        const travel = end === 'front' ? f.forkTravelMm : f.rearWheelTravelMm;
        const shares = styles.map((s) => mmOf(f, end, f.sag[end][s].rider) / travel);
        for (const share of shares) {
          expect(share, `${name(f)} ${end}`).toBeGreaterThanOrEqual(0.23);
          expect(share, `${name(f)} ${end}`).toBeLessThanOrEqual(0.35);
        }
        expect(shares[0]! <= shares[1]! && shares[1]! <= shares[2]!, `${name(f)} ${end}`).toBe(true);
      }
    }
  });

  it('an adventure bike of about 200 mm of rear travel is set near 65 mm of rider sag for adventure riding (common practice)', () => {
    const adventure = all.filter((f) => f.rearWheelTravelMm >= 190 && f.rearWheelTravelMm <= 230 && station(f, 'passenger'));
    expect(adventure.length).toBeGreaterThanOrEqual(5);
    for (const f of adventure) {
      const rider = mmOf(f, 'rear', f.sag.rear.adventure.rider);
      expect(Math.abs(rider - (65 * f.rearWheelTravelMm) / 210), name(f)).toBeLessThanOrEqual(6);
    }
  });

  it('static sag sits well under rider sag, and its tolerance is a few mm on short travel and wider on long travel (common practice)', () => {
    for (const f of all) {
      for (const end of ['front', 'rear'] as const) {
        const travel = end === 'front' ? f.forkTravelMm : f.rearWheelTravelMm;
        const tol = end === 'front' ? f.frontStaticSagToleranceMm! : f.rearStaticSagToleranceMm!;
        // Short travel (up to 150 mm): 3–5 mm; long travel: 5–8 mm.
        if (travel <= 150) expect(tol, `${name(f)} ${end}`).toBeGreaterThanOrEqual(3);
        if (travel <= 150) expect(tol, `${name(f)} ${end}`).toBeLessThanOrEqual(5);
        else expect(tol >= 5 && tol <= 8, `${name(f)} ${end} ±${tol}`).toBe(true);
        for (const s of styles) {
          const st = mmOf(f, end, f.sag[end][s].static);
          const rider = mmOf(f, end, f.sag[end][s].rider);
          expect(st, `${name(f)} ${end} ${s}`).toBeGreaterThan(tol);
          expect(st / rider, `${name(f)} ${end} ${s}`).toBeGreaterThanOrEqual(1 / 6);
          expect(st / rider, `${name(f)} ${end} ${s}`).toBeLessThanOrEqual(0.6);
        }
      }
    }
  });

  it('a road bike’s fork asks near 0.8–1.1 kgf/mm per spring of an 83 kg road rider, where road fork springs usually are (from memory; ±0.05 for “near”)', () => {
    const roadBikes = all.filter((f) => f.forkTravelMm <= 150);
    expect(roadBikes.length).toBeGreaterThanOrEqual(8);
    for (const f of roadBikes) {
      // Both targets met exactly: k = cos θ·W_f / (n·(rider − static sag)), with W_f the rider's share on the front wheel.
      const wf = loadSplit(f.wheelbaseMm, [{ massKg: 83, positionMm: station(f, 'rider')!.positionMm }]).frontN;
      const gap = mmOf(f, 'front', f.sag.front.road.rider) - mmOf(f, 'front', f.sag.front.road.static);
      const kgfPerMm = (Math.cos((f.forkAngleDeg * Math.PI) / 180) * wf) / (f.forkSpringCount * gap) / 9.80665;
      expect(kgfPerMm, name(f)).toBeGreaterThanOrEqual(0.75);
      expect(kgfPerMm, name(f)).toBeLessThanOrEqual(1.15);
    }
  });

  it('catalogue rates lie in the ranges springs are sold in: fork 3–20 N/mm, single shocks 40–250 N/mm, twin-shock pairs 15–50 N/mm (from memory)', () => {
    for (const p of products.springs) {
      const s = p.spring;
      const range = s.end === 'fork' ? [3, 20] : p.name.startsWith('Twin-shock') ? [15, 50] : [40, 250];
      expect(s.rateNPerMm >= range[0]! && s.rateNPerMm <= range[1]!, p.sku).toBe(true);
    }
  });
});
