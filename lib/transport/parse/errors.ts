/** Why a file could not be read at all; warnings (ParseWarning) cover problems the parser can work around. */
export type TransportParseErrorCode =
  | 'empty'
  | 'binary'
  | 'no-data'
  | 'line-too-long'
  | 'too-large'
  | 'unsupported-encoding'
  | 'too-many-header-lines'
  | 'aborted'
  | 'read-failed';

export class TransportParseError extends Error {
  constructor(
    readonly code: TransportParseErrorCode,
    message: string,
    readonly line?: number,
  ) {
    super(message);
    this.name = 'TransportParseError';
  }
}
