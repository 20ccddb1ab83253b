import { definePreset } from '@primeuix/themes';
import Aura from '@primeuix/themes/aura';

/**
 * Crestline's own look on PrimeVue's Aura base: a deep petrol primary, warm-grey surfaces, and an amber
 * used only for cautions. Dark mode follows the `.crest-dark` class on <html>.
 */
export const CrestlinePreset = definePreset(Aura, {
  primitive: {
    petrol: {
      50: '#eef8f7', 100: '#d5eeeb', 200: '#abdcd6', 300: '#78c3bb', 400: '#48a69d', 500: '#2b8a82',
      600: '#216f69', 700: '#1d5a56', 800: '#1a4946', 900: '#173d3b', 950: '#0b2423',
    },
    stone: {
      0: '#ffffff', 50: '#f8f7f4', 100: '#efede8', 200: '#e0ddd5', 300: '#c9c5ba', 400: '#a6a194', 500: '#857f72',
      600: '#686357', 700: '#514d44', 800: '#393631', 900: '#25231f', 950: '#171613',
    },
  },
  semantic: {
    primary: {
      50: '{petrol.50}', 100: '{petrol.100}', 200: '{petrol.200}', 300: '{petrol.300}', 400: '{petrol.400}', 500: '{petrol.500}',
      600: '{petrol.600}', 700: '{petrol.700}', 800: '{petrol.800}', 900: '{petrol.900}', 950: '{petrol.950}',
    },
    colorScheme: {
      light: {
        surface: {
          0: '#ffffff', 50: '{stone.50}', 100: '{stone.100}', 200: '{stone.200}', 300: '{stone.300}', 400: '{stone.400}',
          500: '{stone.500}', 600: '{stone.600}', 700: '{stone.700}', 800: '{stone.800}', 900: '{stone.900}', 950: '{stone.950}',
        },
        primary: { color: '{petrol.700}', contrastColor: '#ffffff', hoverColor: '{petrol.800}', activeColor: '{petrol.900}' },
        // One step darker than Aura's muted text, for 4.5:1 on the warm-grey surfaces (WCAG 1.4.3).
        text: { mutedColor: '{surface.600}' },
        formField: { placeholderColor: '{surface.600}' },
      },
      dark: {
        surface: {
          0: '#ffffff', 50: '#eceff0', 100: '#cfd5d6', 200: '#a9b3b5', 300: '#7f8b8d', 400: '#5d686a', 500: '#434d4f',
          600: '#323a3c', 700: '#252c2e', 800: '#1b2123', 900: '#141819', 950: '#0d1011',
        },
        primary: { color: '{petrol.300}', contrastColor: '{petrol.950}', hoverColor: '{petrol.200}', activeColor: '{petrol.100}' },
        text: { mutedColor: '{surface.300}' },
        formField: { placeholderColor: '{surface.300}' },
      },
    },
  },
  components: {
    // The unchosen options of a SelectButton: Aura's grey is too light to read on its own background.
    togglebutton: {
      colorScheme: {
        light: { root: { color: '{surface.600}' }, icon: { color: '{surface.600}' } },
        dark: { root: { color: '{surface.300}' }, icon: { color: '{surface.300}' } },
      },
    },
    // Text and outlined buttons in Aura's 500 shades fall short of 4.5:1 on white; 700 passes.
    button: {
      colorScheme: {
        light: {
          text: { secondary: { color: '{surface.600}' }, danger: { color: '{red.700}' }, success: { color: '{green.700}' }, warn: { color: '{orange.700}' }, info: { color: '{sky.700}' } },
          outlined: { secondary: { color: '{surface.600}' }, danger: { color: '{red.700}' }, success: { color: '{green.700}' }, warn: { color: '{orange.700}' }, info: { color: '{sky.700}' } },
        },
        dark: { text: { secondary: { color: '{surface.300}' } }, outlined: { secondary: { color: '{surface.300}' } } },
      },
    },
    // Aura's message text (600 on 50) falls short of 4.5:1 for warnings and successes; a step darker passes.
    message: {
      colorScheme: {
        light: {
          info: { color: '{blue.700}', simple: { color: '{blue.700}' } },
          success: { color: '{green.700}', simple: { color: '{green.700}' } },
          warn: { color: '{yellow.800}', simple: { color: '{yellow.800}' } },
          error: { color: '{red.700}', simple: { color: '{red.700}' } },
          secondary: { color: '{surface.700}', simple: { color: '{surface.700}' } },
        },
      },
    },
  },
});
