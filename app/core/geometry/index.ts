export * from './display-geometry';
export * from './placement';
export * from './units';
