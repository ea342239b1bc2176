/* Lengths as people write them: inches with fractions, centimetres, millimetres. */
export * from './length-units';
export * from './parse-length';
export * from './format-length';
