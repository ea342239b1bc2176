export * from './pattern-schema';
export * from './parse-pattern';
export * from './validate-geometry';
export * from './json-schema';
export * from './scale-pattern';
