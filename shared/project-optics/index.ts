export * from './evaluate';
export * from './targets';
