export * from './quilt-types';
export * from './quilt-formulas';
export * from './block-size';
export * from './colourway';
export * from './quilt-plan';
