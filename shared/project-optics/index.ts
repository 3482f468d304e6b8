export * from './evaluate';
export * from './evaluator';
export * from './targets';
export * from './mounting';
export * from './criteria';
export * from './figures';
export * from './vehicle';
export * from './plausibility';
