import { definePreset } from '@primeuix/themes';
import Aura from '@primeuix/themes/aura';

// Loadline's own palette: a deep petrol blue for actions, a warm amber for highlights.
export const LoadlinePreset = definePreset(Aura, {
  primitive: {
    borderRadius: { none: '0', xs: '2px', sm: '4px', md: '6px', lg: '8px', xl: '12px' },
  },
  semantic: {
    primary: {
      50: '#eef6f7',
      100: '#d3e7ea',
      200: '#a9cfd6',
      300: '#74afba',
      400: '#468b99',
      500: '#2a6f7e',
      600: '#1f5a67',
      700: '#16404d',
      800: '#11323c',
      900: '#0c242c',
      950: '#07161b',
    },
    colorScheme: {
      light: {
        surface: {
          0: '#ffffff',
          50: '#f7f8f6',
          100: '#eef0ec',
          200: '#dfe2dc',
          300: '#c6cbc2',
          400: '#9ba297',
          // Muted text and secondary controls use 500: dark enough for 4.5:1 on every light surface up to 100.
          500: '#626a5e',
          600: '#575e54',
          700: '#42483f',
          800: '#2c312a',
          900: '#1c1f1a',
          950: '#0f110e',
        },
        // Unit addons and field icons carry words ("mm", "N/mm"), so they take text contrast, not a border's.
        formField: { iconColor: '{surface.600}' },
      },
    },
  },
  components: {
    // Message text in the 600 shades sits under 4.5:1 on its own tint; 800 reads on the tint, outlined and plain.
    message: {
      colorScheme: {
        light: {
          info: { color: '{blue.800}', outlined: { color: '{blue.800}' }, simple: { color: '{blue.800}' } },
          success: { color: '{green.800}', outlined: { color: '{green.800}' }, simple: { color: '{green.800}' } },
          warn: { color: '{yellow.800}', outlined: { color: '{yellow.800}' }, simple: { color: '{yellow.800}' } },
          error: { color: '{red.800}', outlined: { color: '{red.800}' }, simple: { color: '{red.800}' } },
        },
      },
    },
    // Aura draws text and outlined buttons in the 500 shades, under 4.5:1 on white; ours use 700.
    button: {
      colorScheme: {
        light: {
          outlined: {
            success: { color: '{green.700}', borderColor: '{green.300}' },
            info: { color: '{sky.700}', borderColor: '{sky.300}' },
            warn: { color: '{orange.700}', borderColor: '{orange.300}' },
            help: { color: '{purple.700}', borderColor: '{purple.300}' },
            danger: { color: '{red.700}', borderColor: '{red.300}' },
          },
          text: {
            success: { color: '{green.700}' },
            info: { color: '{sky.700}' },
            warn: { color: '{orange.700}' },
            help: { color: '{purple.700}' },
            danger: { color: '{red.700}' },
          },
        },
      },
    },
  },
});
