import { defineStore } from 'pinia';
import { ref, watch } from 'vue';
import { kgToLb, lbToKg, mmToIn } from '@shared/units';

export type UnitSystem = 'metric' | 'imperial';
const key = 'loadline.units';

/** The rider's choice of kg/mm or lb/in, kept across visits; values inside stay SI. */
export const useUnitsStore = defineStore('units', () => {
  const system = ref<UnitSystem>(localStorage.getItem(key) === 'imperial' ? 'imperial' : 'metric');
  watch(system, (s) => localStorage.setItem(key, s));

  const massUnit = () => (system.value === 'metric' ? 'kg' : 'lb');
  const toMassShown = (kg: number) => (system.value === 'metric' ? kg : kgToLb(kg));
  const fromMassShown = (v: number) => (system.value === 'metric' ? v : lbToKg(v));
  const lengthShown = (mm: number) => (system.value === 'metric' ? { value: mm, unit: 'mm' } : { value: mmToIn(mm), unit: 'in' });

  return { system, massUnit, toMassShown, fromMassShown, lengthShown };
});
