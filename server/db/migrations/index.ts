import { Accounts1764633600000 } from './1764633600000-accounts';

// Listed by hand: globbed .ts migrations do not load under every runner we use.
export const migrations = [Accounts1764633600000];
