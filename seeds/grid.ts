// The loads every demo bike must serve, shared by the design tool that lays out the demo data and the test that walks it.
import type { LoadStationDto } from '../shared/catalogue';

/** Riders from 55 to 120 kg, each with 8 kg of riding gear; a 70 kg passenger where the bike takes one. */
export const gridRiderKg = Array.from({ length: 66 }, (_, i) => 55 + i);
export const gridGearKg = 8;
export const gridPassengerKg = 70;

export interface GridLoad {
  riderKg: number;
  /** Present when two-up. */
  passengerKg?: number;
}

/**
 * Solo for every rider, and two-up where the bike has a passenger seat that takes the passenger and the rated
 * load takes rider, gear and passenger together.
 * @example gridLoadsFor({ ratedLoadKg: 180, loadStations }) // [{ riderKg: 55 }, { riderKg: 55, passengerKg: 70 }, …]
 */
export function gridLoadsFor(f: { ratedLoadKg: number; loadStations: readonly LoadStationDto[] }): GridLoad[] {
  const rider = f.loadStations.find((s) => s.station === 'rider');
  const seat = f.loadStations.find((s) => s.station === 'passenger');
  const out: GridLoad[] = [];
  for (const riderKg of gridRiderKg) {
    if (rider && riderKg + gridGearKg > rider.maxLoadKg) continue;
    out.push({ riderKg });
    if (seat && seat.maxLoadKg >= gridPassengerKg && riderKg + gridGearKg + gridPassengerKg <= f.ratedLoadKg) out.push({ riderKg, passengerKg: gridPassengerKg });
  }
  return out;
}
