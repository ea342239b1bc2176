export * from './plan-copies';
