export { ClipFlashScreen, screenClipFlashes } from './clip-flash-screen';
export { flashCells, type FlashCells, type PxRect } from './flash-cells';
export { FlashFrameAnalyser } from './flash-frame-analyser';
export { FLASH_ANALYSER_VERSION, type FlashAnalysis, type FlashFailure, type FlashKind, type FlashRegion, type FlashSettings } from './flash-result';
export * from './flash-thresholds';
export { LINEAR_OF_SRGB8, luminanceOfLinear, relativeLuminance, srgbToLinear } from './relative-luminance';
export { regionColour, D65_UV, type RegionColour } from './chromaticity';
export { coneSolidAngle, rectangleSolidAngle } from './solid-angle';
export { LIBRARY_SCREENING } from './screening-defaults';
