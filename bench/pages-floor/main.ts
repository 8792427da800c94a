// The floor the pages bench compares the storefront with: Vue, PrimeVue with the shop's preset, Inter and the icons, nothing of ours.
import '@fontsource/inter/400.css';
import '@fontsource/inter/600.css';
import '@fontsource/inter/700.css';
import 'primeicons/primeicons.css';
import PrimeVue from 'primevue/config';
import ConfirmationService from 'primevue/confirmationservice';
import ToastService from 'primevue/toastservice';
import { createApp } from 'vue';
import { LoadlinePreset } from '../../client/src/theme';
import FloorPage from './FloorPage.vue';

// The same nonce slot and PrimeVue options as the storefront, so the theme costs the same.
const slot = document.querySelector<HTMLMetaElement>('meta[name="csp-nonce"]')?.content;
const nonce = slot && slot !== 'loadline-csp-nonce' ? slot : undefined;

const app = createApp(FloorPage);
app.use(PrimeVue, { theme: { preset: LoadlinePreset, options: { darkModeSelector: '.ll-dark', cssLayer: false } }, csp: { nonce } });
app.use(ToastService);
app.use(ConfirmationService);
app.mount('#app');
