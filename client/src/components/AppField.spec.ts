// @vitest-environment happy-dom
import { mount } from '@vue/test-utils';
import { describe, expect, it } from 'vitest';
import { h } from 'vue';
import AppField from './AppField.vue';

const withInput = (props: Record<string, string>) =>
  mount(AppField, {
    props: { id: 'email', label: 'E-mail', ...props },
    slots: { default: (p: { describedBy?: string; invalid: boolean }) => h('input', { id: 'email', 'aria-describedby': p.describedBy, 'aria-invalid': p.invalid }) },
  });

describe('a form field', () => {
  it('labels its input and ties the error message to it for screen readers', () => {
    const w = withInput({ error: 'Enter a valid e-mail address.' });
    expect(w.get('label').attributes('for')).toBe('email');
    const error = w.get('[role="alert"]');
    expect(error.text()).toBe('Enter a valid e-mail address.');
    expect(w.get('input').attributes('aria-describedby')).toBe(error.attributes('id'));
    expect(w.get('input').attributes('aria-invalid')).toBe('true');
  });

  it('shows the hint while there is no error, and the error instead of it when there is', async () => {
    const w = withInput({ hint: 'At least 10 characters.' });
    expect(w.text()).toContain('At least 10 characters.');
    expect(w.find('[role="alert"]').exists()).toBe(false);
    await w.setProps({ error: 'Too short.' });
    expect(w.text()).not.toContain('At least 10 characters.');
    expect(w.get('[role="alert"]').text()).toBe('Too short.');
  });
});
