export * from './question';
export * from './scene';
export * from './rank';
