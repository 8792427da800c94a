export * from './shop-settings';
export * from './dashboard';
