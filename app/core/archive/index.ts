export { ArchiveFormatError } from './archive-error';
export { ARCHIVE_FORMAT, ARCHIVE_FORMAT_VERSION, archiveManifest, MANIFEST_FILE, recordingFilePath, tableFile, tableNames, type ArchiveManifest } from './archive-manifest';
export { parseManifest } from './parse-manifest';
export { countRecords, decodeTable, encodeTable } from './table-codec';
export { sha256Hex } from './sha256';
