import type { FitmentDto, LoadCaseInputDto, ResolvedLoadDto } from '../catalogue';

type LoadSet = Pick<LoadCaseInputDto, 'rider' | 'passengerKg' | 'luggage'>;

/**
 * Places a rider, passenger and luggage on the bike's stations; refuses, per field, a station the bike
 * does not have, a load over a station's limit, and a total over the bike's rated load.
 */
export function placeLoads(f: FitmentDto, set: LoadSet, prefix = ''): { loads: ResolvedLoadDto[]; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const station = (s: string) => f.loadStations.find((x) => x.station === s);
  const loads: ResolvedLoadDto[] = [];
  const rider = station('rider')!;
  const riderKg = set.rider.massKg + set.rider.gearKg;
  if (riderKg > rider.maxLoadKg) problems[`${prefix}rider.massKg`] = `The rider seat takes at most ${rider.maxLoadKg} kg, rider and gear together; this is ${round(riderKg)} kg.`;
  loads.push({ station: 'rider', massKg: riderKg, positionMm: rider.positionMm });
  if (set.passengerKg) {
    const seat = station('passenger');
    if (!seat) problems[`${prefix}passengerKg`] = 'This bike has no passenger seat.';
    else if (set.passengerKg > seat.maxLoadKg) problems[`${prefix}passengerKg`] = `The passenger seat takes at most ${seat.maxLoadKg} kg.`;
    else loads.push({ station: 'passenger', massKg: set.passengerKg, positionMm: seat.positionMm });
  }
  const perStation = new Map<string, number>();
  for (const [i, l] of (set.luggage ?? []).entries()) {
    if (!l.massKg) continue;
    const st = station(l.station);
    if (!st) {
      problems[`${prefix}luggage.${i}.station`] = `This bike has no ${l.station.replace('-', ' ')} mount.`;
      continue;
    }
    const total = (perStation.get(l.station) ?? 0) + l.massKg;
    perStation.set(l.station, total);
    if (total > st.maxLoadKg) problems[`${prefix}luggage.${i}.massKg`] = `The ${l.station.replace('-', ' ')} takes at most ${st.maxLoadKg} kg; this makes ${round(total)} kg.`;
    loads.push({ station: l.station, massKg: l.massKg, positionMm: st.positionMm });
  }
  const total = loads.reduce((s, l) => s + l.massKg, 0);
  if (total > f.ratedLoadKg) problems[`${prefix}load`] = `The bike is rated for ${f.ratedLoadKg} kg of riders, gear and luggage; this is ${round(total)} kg.`;
  return { loads, problems };
}

const round = (n: number) => Math.round(n * 10) / 10;
