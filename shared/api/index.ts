export * from './schemas';
export * from './types';
