// Moved to shared/recommend so the finder builds the same engine input in the browser.
export * from '../../shared/recommend/engine-input';
