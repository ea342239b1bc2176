export * from './matching-marks';
