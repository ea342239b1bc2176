export * from './pattern-schema';
export * from './parse-pattern';
export * from './validate-geometry';
