export * from './schemas';
export * from './types';
export * from './share-links';
export * from './library';
