import { ref } from 'vue';

const KEY = 'crestline.colorScheme';
const dark = ref(false);

function apply(value: boolean) {
  dark.value = value;
  document.documentElement.classList.toggle('crest-dark', value);
}

/** Restores the scheme chosen last time, else follows the system's preference. */
export function applyStoredColorScheme() {
  const stored = localStorage.getItem(KEY);
  apply(stored ? stored === 'dark' : window.matchMedia?.('(prefers-color-scheme: dark)').matches === true);
}

export function useColorScheme() {
  return {
    dark,
    toggle() {
      apply(!dark.value);
      localStorage.setItem(KEY, dark.value ? 'dark' : 'light');
    },
  };
}
