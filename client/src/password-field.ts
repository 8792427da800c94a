/**
 * For PrimeVue's Password without its strength meter: it still marks the text box aria-expanded and aria-haspopup,
 * which a text box may not carry (axe: aria-allowed-attr); the field opens nothing, so both go.
 */
export const passwordInputProps = { 'aria-expanded': undefined, 'aria-haspopup': undefined } as const;
