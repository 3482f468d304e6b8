export * from './evaluate';
export * from './evaluator';
export * from './targets';
export * from './mounting';
