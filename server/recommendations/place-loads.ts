// Moved to shared/recommend so the finder places loads in the browser by the same rule.
export * from '../../shared/recommend/place-loads';
