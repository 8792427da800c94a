import { Accounts1764633600000 } from './1764633600000-accounts';
import { Catalogue1764720000000 } from './1764720000000-catalogue';
import { FitmentTolerances1764806400000 } from './1764806400000-fitment-tolerances';
import { RateLimitCounters1764892800000 } from './1764892800000-rate-limit-counters';
import { MailOutbox1764979200000 } from './1764979200000-mail-outbox';
import { Commerce1764982800000 } from './1764982800000-commerce';
import { RiderBikes1765310000000 } from './1765310000000-rider-bikes';
import { ShopSettingsAdmin1765350000000 } from './1765350000000-shop-settings-admin';
import { StockLedgerFulfilment1765330000000 } from './1765330000000-stock-ledger-fulfilment';
import { Exchanges1765340000000 } from './1765340000000-exchanges';

// Listed by hand: globbed .ts migrations do not load under every runner we use.
export const migrations = [
  Accounts1764633600000,
  Catalogue1764720000000,
  FitmentTolerances1764806400000,
  RateLimitCounters1764892800000,
  MailOutbox1764979200000,
  Commerce1764982800000,
  RiderBikes1765310000000,
  StockLedgerFulfilment1765330000000,
  Exchanges1765340000000,
  ShopSettingsAdmin1765350000000,
];
