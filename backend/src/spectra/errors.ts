/** Stable codes a caller (CLI, API) can switch on; messages are sentences for people. */
export type SpectrumReadErrorCode =
  | 'empty-file'
  | 'unknown-format'
  | 'fits-header'
  | 'fits-size'
  | 'fits-table'
  | 'fits-no-spectrum'
  | 'fits-wcs'
  | 'gzip'
  | 'text-table'
  | 'no-valid-pixels'
  | 'bad-wavelength'
  | 'too-many-pixels';

/** The only error readers throw: anything else escaping a reader is a bug. */
export class SpectrumReadError extends Error {
  readonly code: SpectrumReadErrorCode;
  constructor(code: SpectrumReadErrorCode, message: string) {
    super(message);
    this.name = 'SpectrumReadError';
    this.code = code;
  }
}
