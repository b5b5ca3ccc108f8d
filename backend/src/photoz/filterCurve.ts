/** A filter's transmission curve: wavelength in Å (vacuum), strictly increasing; dimensionless transmission. */
export interface FilterCurve {
  /** The filter's name: the file stem of a shipped curve (e.g. "wfc3_ir_f160w") or a campaign's own name. */
  name: string;
  wavelength: Float64Array;
  transmission: Float64Array;
}

/** Why a curve was refused, with the 1-based line of the text it concerns (0 when it is about the whole text). */
export class FilterCurveError extends Error {
  readonly line: number;
  constructor(line: number, message: string) {
    super(message);
    this.name = 'FilterCurveError';
    this.line = line;
  }
}

/** Fewer samples than this cannot describe a passband (rise, plateau, fall); common practice. */
export const MIN_FILTER_POINTS = 5;
/**
 * Upper bound on a transmission value. Curves are throughputs (≤ 1) or relative responses that may
 * be normalised to a peak a little above 1; 1.5 catches a curve given in per cent.
 */
export const MAX_TRANSMISSION = 1.5;

/**
 * Parses a filter curve from text: lines of two numbers, wavelength (Å) and transmission,
 * separated by spaces, tabs or one comma; `#` starts a comment (whole line or trailing); blank
 * lines are skipped. This is both the shipped `line-lists/filters/*.par` format and the
 * two-column curve a campaign may add. Refuses, naming the line: a line that is not two numbers,
 * a wavelength that is not positive and finite, wavelengths that do not strictly increase, a
 * transmission outside [0, 1.5], fewer than five samples, or a curve with no positive transmission.
 *
 * @param text the file's text
 * @param name the filter's name, kept on the curve and used in messages
 * @throws FilterCurveError
 */
export function parseFilterCurve(text: string, name: string): FilterCurve {
  const wavelength: number[] = [];
  const transmission: number[] = [];
  const lines = text.split(/\r\n|\n|\r/);
  let previousLine = 0;
  for (let i = 0; i < lines.length; i++) {
    const lineNo = i + 1;
    const hash = lines[i]!.indexOf('#');
    const body = (hash >= 0 ? lines[i]!.slice(0, hash) : lines[i]!).trim();
    if (body === '') continue;
    const fields = body.split(/\s*,\s*|\s+/);
    if (fields.length !== 2) {
      throw new FilterCurveError(lineNo, `${name}: line ${lineNo} has ${fields.length} field${fields.length === 1 ? '' : 's'} ("${body.slice(0, 60)}"); a filter curve needs two: wavelength in Å and transmission`);
    }
    const lam = Number(fields[0]);
    const t = Number(fields[1]);
    if (!Number.isFinite(lam) || !Number.isFinite(t) || fields[0] === '' || fields[1] === '') {
      throw new FilterCurveError(lineNo, `${name}: line ${lineNo} is not two numbers ("${body.slice(0, 60)}")`);
    }
    if (!(lam > 0)) throw new FilterCurveError(lineNo, `${name}: line ${lineNo}: wavelength ${fields[0]} must be positive (Å)`);
    const prev = wavelength[wavelength.length - 1];
    if (prev !== undefined && !(lam > prev)) {
      throw new FilterCurveError(lineNo, `${name}: line ${lineNo}: wavelength ${fields[0]} Å does not increase on line ${previousLine} (${prev} Å); wavelengths must be strictly increasing`);
    }
    if (t < 0 || t > MAX_TRANSMISSION) {
      throw new FilterCurveError(lineNo, `${name}: line ${lineNo}: transmission ${fields[1]} is outside [0, ${MAX_TRANSMISSION}]${t > MAX_TRANSMISSION && t <= 100 ? ' (a curve in per cent must be divided by 100)' : ''}`);
    }
    wavelength.push(lam);
    transmission.push(t);
    previousLine = lineNo;
  }
  if (wavelength.length < MIN_FILTER_POINTS) {
    throw new FilterCurveError(0, `${name}: ${wavelength.length} sample${wavelength.length === 1 ? '' : 's'}; a filter curve needs at least ${MIN_FILTER_POINTS} (wavelength, transmission) lines`);
  }
  if (!transmission.some((t) => t > 0)) throw new FilterCurveError(0, `${name}: every transmission is zero`);
  return { name, wavelength: Float64Array.from(wavelength), transmission: Float64Array.from(transmission) };
}
