// Words for the catalogue's closed sets; typed against the shared contract so a new value fails the type-check here.
import type { LoadStationKind, ProductKind, RidingStyle, SpringEnd, SpringEndType } from '@shared/catalogue';

export const stationLabels: Record<LoadStationKind, string> = {
  rider: 'Rider seat',
  passenger: 'Passenger seat',
  'tank-bag': 'Tank bag',
  panniers: 'Panniers',
  'top-case': 'Top case',
};
export const stationKinds = Object.keys(stationLabels) as LoadStationKind[];

export const kindLabels: Record<ProductKind, string> = {
  spring: 'Spring',
  adapter: 'Adapter kit',
  tool: 'Tool',
  accessory: 'Accessory',
};
export const productKindOptions = (Object.keys(kindLabels) as ProductKind[]).map((value) => ({ value, label: kindLabels[value] }));

export const endLabels: Record<SpringEnd, string> = { fork: 'Fork', shock: 'Shock' };
export const springEndOptions = (Object.keys(endLabels) as SpringEnd[]).map((value) => ({ value, label: endLabels[value] }));

export const endTypeLabels: Record<SpringEndType, string> = {
  plain: 'Plain',
  'plain-ground': 'Plain and ground',
  squared: 'Squared (closed)',
  'squared-ground': 'Squared and ground',
};

/** The sag DTO spells off-road as `offRoad`; the riding-style list spells it `off-road`. */
export const sagStyles: { key: 'road' | 'adventure' | 'offRoad'; style: RidingStyle; label: string }[] = [
  { key: 'road', style: 'road', label: 'Road' },
  { key: 'adventure', style: 'adventure', label: 'Adventure' },
  { key: 'offRoad', style: 'off-road', label: 'Off-road' },
];
