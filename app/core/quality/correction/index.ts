export * from './check-pairs';
export * from './correct-samples';
export * from './correction-record';
export * from './least-squares';
export * from './map-terms';
export * from './models';
export * from './raw-calibration';
