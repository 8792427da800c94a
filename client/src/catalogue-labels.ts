// Words for the catalogue's closed sets; typed against the shared contract so a new value fails the type-check here.
import {
  loadStationKinds,
  productKinds,
  ridingStyles,
  springEnds,
  springEndTypes,
  type LoadStationKind,
  type ProductKind,
  type RidingStyle,
  type SpringEnd,
  type SpringEndType,
} from '@shared/catalogue/constants';

export const stationLabels: Record<LoadStationKind, string> = {
  rider: 'Rider seat',
  passenger: 'Passenger seat',
  'tank-bag': 'Tank bag',
  panniers: 'Panniers',
  'top-case': 'Top case',
};
export const stationKinds: readonly LoadStationKind[] = loadStationKinds;

export const kindLabels: Record<ProductKind, string> = {
  spring: 'Spring',
  adapter: 'Adapter kit',
  tool: 'Tool',
  accessory: 'Accessory',
};
export const productKindOptions = productKinds.map((value) => ({ value, label: kindLabels[value] }));

export const endLabels: Record<SpringEnd, string> = { fork: 'Fork', shock: 'Shock' };
export const springEndOptions = springEnds.map((value) => ({ value, label: endLabels[value] }));

export const endTypeLabels: Record<SpringEndType, string> = {
  plain: 'Plain',
  'plain-ground': 'Plain and ground',
  squared: 'Squared (closed)',
  'squared-ground': 'Squared and ground',
};
export const springEndTypeOptions = springEndTypes.map((value) => ({ value, label: endTypeLabels[value] }));

export const ridingStyleLabels: Record<RidingStyle, string> = { road: 'Road', adventure: 'Adventure', 'off-road': 'Off-road' };
export const ridingStyleOptions = ridingStyles.map((value) => ({ value, label: ridingStyleLabels[value] }));

/** The sag DTO spells off-road as `offRoad`; the riding-style list spells it `off-road`. */
const sagKeys: Record<RidingStyle, 'road' | 'adventure' | 'offRoad'> = { road: 'road', adventure: 'adventure', 'off-road': 'offRoad' };
export const sagStyles = ridingStyles.map((style) => ({ key: sagKeys[style], style, label: ridingStyleLabels[style] }));
