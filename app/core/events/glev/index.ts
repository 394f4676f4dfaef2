// Gazeloom's binary event file (.glev): the layout is documented in layout.ts.
export { decodeGlev, decodeGlevInto, type GlevDecodeOptions } from './decode';
export { encodeGlev } from './encode';
export { bytesSource, openGlev, type ByteSource, type GlevChunkInfo, type GlevInfo, type GlevPosition, type GlevReader, type GlevVerification } from './reader';
export { GlevWriter, type GlevWriterOptions } from './writer';
