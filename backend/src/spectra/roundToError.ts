/** A value written with the digits its error supports. */
export interface RoundedValue {
  value: number;
  error: number;
  /** Decimal places of both texts. */
  decimals: number;
  valueText: string;
  errorText: string;
}

/**
 * Rounds a value to the digits its 1σ error supports: the error to `digits` significant digits
 * (default 2, common practice), rounded up so the written error is never smaller than the
 * computed one, and the value to the same decimal place. Example: roundToError(1.234567891,
 * 0.000391) → value 1.23457, error 0.00040, texts "1.23457" and "0.00040".
 * Throws a RangeError for a non-finite value or an error that is not a positive finite number.
 */
export function roundToError(value: number, error: number, digits = 2): RoundedValue {
  if (!Number.isFinite(value)) throw new RangeError(`Cannot round a non-finite value (${value}).`);
  if (!Number.isFinite(error) || error <= 0) throw new RangeError(`The error must be a positive finite number, not ${error}.`);
  if (!Number.isInteger(digits) || digits < 1 || digits > 15) throw new RangeError(`Significant digits must be a whole number from 1 to 15, not ${digits}.`);
  let decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(error)));
  let scale = 10 ** decimals;
  // Tiny guard against 0.1 + 0.2 style residue before the ceiling (0.00039000000000000005 → 0.00039).
  let roundedError = Math.ceil(error * scale - 1e-9) / scale;
  // Rounding up can add a digit (0.000995 → 0.0010): then one decimal fewer keeps `digits` digits.
  if (decimals > 0 && Math.round(roundedError * scale) >= 10 ** digits) {
    decimals -= 1;
    scale = 10 ** decimals;
    roundedError = Math.ceil(error * scale - 1e-9) / scale;
  }
  const roundedValue = Math.round(value * scale) / scale;
  return {
    value: roundedValue,
    error: roundedError,
    decimals,
    valueText: roundedValue.toFixed(decimals),
    errorText: roundedError.toFixed(decimals),
  };
}
