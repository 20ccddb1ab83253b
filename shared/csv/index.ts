export { CaptureReader, type CaptureData, type CaptureReaderOptions, type ChannelData } from './CaptureReader';
export { parseColumnHeader, timeUnitScale } from './columnHeader';
export { CsvError, MAX_MESSAGE_CHARS } from './CsvError';
export { detectEncoding, type EncodingGuess } from './detectEncoding';
export { readCaptureBytes, type ReadCaptureOptions } from './readCaptureBytes';
export { DEFAULT_READ_LIMITS, resolveReadLimits, type ReadLimits } from './readLimits';
export type { CaptureLayout } from './sniffLayout';
