import { defineStore } from 'pinia';
import { ref, watch } from 'vue';
import { formatLength, formatLengthChange, type LengthFormatOptions, type UnitSystem } from '@shared/length-format';
import { kgToLb, lbToKg, mmToIn } from '@shared/units';

export type { UnitSystem };
const key = 'loadline.units';

/** The rider's choice of kg/mm or lb/in, kept across visits; values inside stay SI. */
export const useUnitsStore = defineStore('units', () => {
  const system = ref<UnitSystem>(localStorage.getItem(key) === 'imperial' ? 'imperial' : 'metric');
  watch(system, (s) => localStorage.setItem(key, s));

  const massUnit = () => (system.value === 'metric' ? 'kg' : 'lb');
  const toMassShown = (kg: number) => (system.value === 'metric' ? kg : kgToLb(kg));
  const fromMassShown = (v: number) => (system.value === 'metric' ? v : lbToKg(v));
  const lengthShown = (mm: number) => (system.value === 'metric' ? { value: mm, unit: 'mm' } : { value: mmToIn(mm), unit: 'in' });
  /** A length as this rider reads it: "12.5 mm", or "0.49 in (12.5 mm)" for an lb rider (shared/length-format). */
  const length = (mm: number | null | undefined, options?: LengthFormatOptions) => formatLength(mm, system.value, options);
  /** A signed change of length: "+5 mm", "+0.2 in (+5 mm)". */
  const lengthChange = (mm: number | null | undefined, options?: LengthFormatOptions) => formatLengthChange(mm, system.value, options);

  return { system, massUnit, toMassShown, fromMassShown, lengthShown, length, lengthChange };
});
