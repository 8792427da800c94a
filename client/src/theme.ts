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
          500: '#737b6f',
          600: '#575e54',
          700: '#42483f',
          800: '#2c312a',
          900: '#1c1f1a',
          950: '#0f110e',
        },
      },
    },
  },
});
