// @vitest-environment happy-dom
import { mount } from '@vue/test-utils';
import PrimeVue from 'primevue/config';
import { describe, expect, it } from 'vitest';
import { nextTick, reactive } from 'vue';
import { emptySpringDraft, type SpringDraft } from '../composables/useProductForm';
import StaffProductEditPageSpring from './StaffProductEditPageSpring.vue';

// Shigley's Mechanical Engineering Design, 10th ed., Problem 10-3: music wire, d = 2.5 mm, OD = 31 mm,
// plain-ground ends, Nt = 14 → k ≈ 1.314 N/mm, Ls = 35 mm (the book rounds to three figures).
function mountForm(start: Partial<SpringDraft> = {}) {
  const draft = reactive<SpringDraft>({ ...emptySpringDraft(), endType: 'plain-ground', material: 'music-wire', ...start });
  const wrapper = mount(StaffProductEditPageSpring, {
    props: { modelValue: draft, errors: {} },
    global: { plugins: [PrimeVue] },
  });
  const type = async (id: string, text: string) => {
    await wrapper.get(`#${id}`).setValue(text);
    await nextTick();
  };
  return { wrapper, draft, type };
}

describe('the spring form computes the geometry as staff type', () => {
  it('asks for the missing figures until wire, outer diameter and coils are given', async () => {
    const { wrapper, type } = mountForm();
    expect(wrapper.get('[data-testid="spring-geometry"]').text()).toContain('Enter the wire diameter');
    await type('s-wire', '2.5');
    await type('s-outer', '31');
    expect(wrapper.find('[data-testid="computed-rate"]').exists()).toBe(false);
    await type('s-coils', '14');
    expect(wrapper.get('[data-testid="computed-rate"]').text()).toMatch(/^1\.31\s*N\/mm$/);
    expect(wrapper.get('[data-testid="computed-solid"]').text()).toMatch(/^35\s*mm$/);
  });

  it('updates the computed rate on every keystroke of the wire diameter', async () => {
    const { wrapper, type } = mountForm({ outerDiameterMm: 31, totalCoils: 14 });
    await type('s-wire', '2.5');
    const thin = wrapper.get('[data-testid="computed-rate"]').text();
    await type('s-wire', '2.6');
    const thick = wrapper.get('[data-testid="computed-rate"]').text();
    expect(thin).not.toBe(thick);
    // k grows with d⁴ / D³: 2.6 mm wire on the same outer diameter gives about 1.55 N/mm.
    expect(thick).toMatch(/^1\.5\d\s*N\/mm$/);
  });

  it('flags a stated rate more than 5 % from the geometry, and clears the flag when it is corrected', async () => {
    const { wrapper, type } = mountForm({ wireDiameterMm: 2.5, outerDiameterMm: 31, totalCoils: 14 });
    await type('s-rate', '1.45');
    expect(wrapper.get('[data-testid="rate-flag"]').text()).toContain('+10.3');
    expect(wrapper.find('[data-testid="rate-agrees"]').exists()).toBe(false);
    await type('s-rate', '1,3');
    expect(wrapper.find('[data-testid="rate-flag"]').exists()).toBe(false);
    expect(wrapper.get('[data-testid="rate-agrees"]').text()).toContain('−1.1');
  });

  it('says why there is no figure when the geometry cannot be a spring', async () => {
    const { wrapper } = mountForm({ wireDiameterMm: 12, outerDiameterMm: 20, totalCoils: 8 });
    await nextTick();
    expect(wrapper.get('[data-testid="spring-geometry"]').text()).toContain('Outside diameter must be more than twice the wire diameter');
  });

  it('shows the server\'s message under the field it belongs to', () => {
    const draft = reactive(emptySpringDraft());
    const wrapper = mount(StaffProductEditPageSpring, {
      props: { modelValue: draft, errors: { 'spring.wireDiameterMm': 'Wire diameter is at most 25 mm.' } },
      global: { plugins: [PrimeVue] },
    });
    const input = wrapper.get('#s-wire');
    const error = wrapper.get('#s-wire-error');
    expect(error.text()).toBe('Wire diameter is at most 25 mm.');
    expect(input.attributes('aria-describedby')).toContain('s-wire-error');
  });
});
