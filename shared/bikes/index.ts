export * from './bike.dto';
export * from './bike-sag-input';
