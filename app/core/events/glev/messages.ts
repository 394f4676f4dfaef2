/**
 * How .glev problems are located in EventFormatError: the region (header, chunk K, index),
 * then the byte where the problem was found, counted from the start of the file. A problem
 * with a whole chunk (a CRC mismatch, a cut) names the chunk's first byte.
 */
export const headerAt = (byte: number): string => `header, byte ${byte}`;
export const chunkAt = (chunk: number, byte: number): string => `chunk ${chunk}, byte ${byte}`;
export const indexAt = (byte: number): string => `index, byte ${byte}`;
export const indexEntryAt = (chunk: number, byte: number): string => `index entry ${chunk}, byte ${byte}`;

export const hex32 = (value: number): string => `0x${value.toString(16).padStart(8, '0')}`;
