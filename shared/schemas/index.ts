export * from './common';
export * from './auth';
