export * from './quilt-types';
