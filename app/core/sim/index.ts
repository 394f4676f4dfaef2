export { DvsPixelModel } from './dvs-pixel-model';
export { DEFAULT_DVS_PARAMS, MIN_CONTRAST_THRESHOLD, type DvsParams } from './dvs-params';
export { EventBuffer } from './event-buffer';
export { DARK_INTENSITY, toLogIntensity } from './log-intensity';
export * from './simulate';
export { BEACON_ROTATION_HZ, DEFAULT_OBJECT_GROUPS, FLICKER_HZ, OBJECT_IDS, PARCEL_ID_BASE, WAREHOUSE_OBJECT_GROUPS, type WarehouseObjectGroup } from './warehouse-objects';
export { WarehouseScene, warehouseFlashingParts, type PixelRect, type WarehouseSceneOptions } from './warehouse-scene';
