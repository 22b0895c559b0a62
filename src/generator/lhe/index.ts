export { formatLheReal, formatLheInteger, LHE_MAX_PARTICLES, LHE_STATUS_CODES, type LheInit, type LheProcess } from './lheFormat.js';
export { LheWriter, formatLheEvent, formatLheStart, LHE_END, type LheHeaderInfo } from './lheWriter.js';
export { LheParser, type LheEventHandler, type LheReadResult } from './lheParser.js';
export { readLheFile, parseLheText, type LheReadOptions } from './lheReader.js';
