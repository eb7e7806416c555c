export { parseTransportTable, parseTransportText, DEFAULT_MAX_BYTES, DEFAULT_MAX_LINE_BYTES } from './parse-transport-table';
export { bytesFromBuffer, bytesFromWebStream } from './sources';
export { TransportParseError, type TransportParseErrorCode } from './errors';
export { detectEncoding } from './encoding';
export { splitHeaderCell } from './header';
export { quantityFromName } from './quantity-names';
export type {
  ByteSource,
  ColumnOverride,
  ColumnRole,
  DecimalSeparator,
  Delimiter,
  ParsedColumn,
  ParsedTable,
  ParseOptions,
  ParseWarning,
  ParseWarningCode,
  TransportQuantity,
} from './types';
