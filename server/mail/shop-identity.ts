import type { Shop } from './templates/layout';

// Mails that are not about an order (password reset) sign with this; order mails carry the shop from its settings.
export const loadlineShop: Shop = {
  name: 'Loadline suspension workshop',
  address: 'Unit 4, Damper Lane 12\n4410 Loadford',
};
