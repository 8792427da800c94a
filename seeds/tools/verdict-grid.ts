// Measures the finder against the sag check over the demo grid: every demo bike × riding style × rider 55–120 kg with
// 8 kg of gear, solo and two-up with a 70 kg passenger where the bike has a seat and its rated load allows. Counts the
// ends whose first spring is not ok, and the ok candidates that the sag check, fed their predicted readings, calls
// anything else. Run against a migrated, seeded database:
//   DATABASE_URL=postgres://postgres@127.0.0.1:<port>/<db> npx tsx --tsconfig tsconfig.server.json seeds/tools/verdict-grid.ts
import 'reflect-metadata';
import { ridingStyles, type RecommendationDto, type RecommendedSpringDto, type SpringCandidateDto } from '../../shared/catalogue';
import { checkSag, type SagCheckInput } from '../../shared/engine';
import { AppDataSource } from '../../server/db/data-source';
import { Fitment } from '../../server/fitment/Fitment.entity';
import { toFitmentDto, type FitmentWithBike } from '../../server/fitment/fitment.service';
import { createBikeCache, recommend } from '../../server/recommendations/recommendations.service';

const ds = await AppDataSource.initialize();
const cache = createBikeCache(600_000);
const counts = { ends: 0, firstNotOk: 0, noOk: 0, okCandidates: 0, sagCheckDisagrees: 0 };
const examples: string[] = [];
try {
  for (const entity of await ds.getRepository(Fitment).find({ relations: { bike: true } })) {
    const f = toFitmentDto(entity as FitmentWithBike);
    const seat = f.loadStations.find((s) => s.station === 'passenger');
    for (const ridingStyle of ridingStyles) {
      for (let massKg = 55; massKg <= 120; massKg += 1) {
        const loadsets = [undefined, ...(seat && massKg + 8 + 70 <= f.ratedLoadKg && 70 <= seat.maxLoadKg ? [70] : [])];
        for (const passengerKg of loadsets) {
          if (massKg + 8 > (f.loadStations.find((s) => s.station === 'rider')?.maxLoadKg ?? Infinity)) continue;
          const r: RecommendationDto = await recommend({ fitmentId: f.id, ridingStyle, rider: { massKg, gearKg: 8 }, ...(passengerKg ? { passengerKg } : {}) }, cache);
          if (!('candidates' in r.fork) || !('candidates' in r.shock)) throw new Error('expected the single-load shape');
          const label = `${r.fitment.make} ${r.fitment.model} ${r.fitment.variant} ${ridingStyle} ${massKg} kg${passengerKg ? ' two-up' : ''}`;
          const ends = [
            { name: 'fork', end: r.fork, riderLoadN: r.fork.frontLoadN, targets: r.targets.fork },
            { name: 'shock', end: r.shock, riderLoadN: r.shock.rearLoadN, targets: r.targets.shock },
          ] as const;
          for (const e of ends) {
            counts.ends += 1;
            const first = e.end.candidates[0];
            if (first?.verdict !== 'ok') counts.firstNotOk += 1;
            if (!e.end.candidates.some((c) => c.verdict === 'ok')) counts.noOk += 1;
            const okOnes: SpringCandidateDto[] = [...e.end.candidates.filter((c: RecommendedSpringDto) => c.verdict === 'ok'), ...(e.end.stock.verdict === 'ok' ? [e.end.stock] : [])];
            for (const c of okOnes) {
              counts.okCandidates += 1;
              // The readings a rider would take if the spring sits exactly as predicted (figures as the API shows them).
              const common = { extendedMm: 600, staticMm: 600 - c.staticSagMm, riderMm: 600 - c.riderSagMm, targets: e.targets, toleranceMm: e.targets.staticSagToleranceMm, bikeLoadN: e.end.bikeLoadN, riderLoadN: e.riderLoadN };
              const input: SagCheckInput =
                e.name === 'fork'
                  ? { ...common, end: 'front', forkAngleDeg: f.forkAngleDeg, springCount: f.forkSpringCount, ...(f.forkAdjusterPitchMm === null ? {} : { adjusterPitchMm: f.forkAdjusterPitchMm }) }
                  : { ...common, end: 'rear', leverageRatio: f.rearLeverageCurve ?? f.rearLeverageRatio!, adjusterPitchMm: f.rearAdjusterPitchMm, shockCount: f.shockCount };
              const s = checkSag(input);
              if (s.springVerdict !== 'ok') {
                counts.sagCheckDisagrees += 1;
                if (examples.length < 10) examples.push(`${label} ${e.name} ${c.id}: sag check ${s.springVerdict} (${s.springReason ?? ''})`);
              }
            }
          }
        }
      }
    }
  }
  console.log(JSON.stringify(counts));
  for (const x of examples) console.log(x);
} finally {
  await ds.destroy();
}
