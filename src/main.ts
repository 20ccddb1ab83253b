import '@fontsource/inter/400.css';
import '@fontsource/inter/500.css';
import '@fontsource/inter/600.css';
import 'primeicons/primeicons.css';
import './assets/app.css';
import { createPinia } from 'pinia';
import PrimeVue from 'primevue/config';
import ConfirmationService from 'primevue/confirmationservice';
import ToastService from 'primevue/toastservice';
import Tooltip from 'primevue/tooltip';
import { createApp } from 'vue';
import App from './App.vue';
import { router } from './router';
import { CrestlinePreset } from './theme/preset';
import { applyStoredColorScheme } from './composables/useColorScheme';

applyStoredColorScheme();
createApp(App)
  .use(createPinia())
  .use(router)
  .use(PrimeVue, {
    theme: { preset: CrestlinePreset, options: { darkModeSelector: '.crest-dark', cssLayer: false } },
    // A password field is no combobox: PrimeVue's aria-expanded on it is an ARIA error (axe: aria-allowed-attr).
    pt: { password: { pcInputText: { root: { 'aria-expanded': undefined } } } },
  })
  .use(ToastService)
  .use(ConfirmationService)
  .directive('tooltip', Tooltip)
  .mount('#app');
