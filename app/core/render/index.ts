export { EventImageRenderer } from './event-image-renderer';
export { renderFrameAt } from './render-frame-at';
export { resolveLook, type LookName, type LookSettings, type ResolvedLook } from './look-settings';
export { DECAY_CUTOFF_TAUS, DECAY_TABLE_STEPS, DECAY_WEIGHT_MAX_ERROR } from './decay-table';
export * from './render-defaults';
