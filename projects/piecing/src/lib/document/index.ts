export * from './pattern-schema';
export * from './parse-pattern';
