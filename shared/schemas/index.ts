export * from './common';
export * from './auth';
export * from './catalog';
export * from './projects';
export * from './sheets';
export * from './limits';
export * from './criteria';
export * from './rules';
