export * from './evaluate';
export * from './evaluator';
export * from './targets';
export * from './criteria';
export * from './figures';
