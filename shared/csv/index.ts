export { CaptureReader, type CaptureData, type ChannelData } from './CaptureReader';
export { parseColumnHeader, timeUnitScale } from './columnHeader';
export { CsvError, MAX_MESSAGE_CHARS } from './CsvError';
export { detectEncoding, type EncodingGuess } from './detectEncoding';
export type { CaptureLayout } from './sniffLayout';
