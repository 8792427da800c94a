import '@fontsource/inter/400.css';
import '@fontsource/inter/600.css';
import '@fontsource/inter/700.css';
import 'primeicons/primeicons.css';
import './styles.css';
import { createPinia } from 'pinia';
import PrimeVue from 'primevue/config';
import ToastService from 'primevue/toastservice';
import ConfirmationService from 'primevue/confirmationservice';
import { createApp } from 'vue';
import App from './App.vue';
import { router } from './router';
import { LoadlinePreset } from './theme';

// The server puts this response's style nonce in the page; the dev server leaves the slot as it is.
const slot = document.querySelector<HTMLMetaElement>('meta[name="csp-nonce"]')?.content;
const nonce = slot && slot !== 'loadline-csp-nonce' ? slot : undefined;

const app = createApp(App);
app.use(createPinia());
app.use(router);
app.use(PrimeVue, { theme: { preset: LoadlinePreset, options: { darkModeSelector: '.ll-dark', cssLayer: false } }, csp: { nonce } });
app.use(ToastService);
app.use(ConfirmationService);
app.mount('#app');
