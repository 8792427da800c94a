export * from './common';
export * from './fitment.dto';
export * from './product.dto';
export * from './compatibility.dto';
export * from './recommendation.dto';
export * from './audit.dto';
export * from './csv.dto';
export * from './ranges';
