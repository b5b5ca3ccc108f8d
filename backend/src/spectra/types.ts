/** Template classes the engine can propose; 'unknown' means no decision. */
export type TemplateClass = 'galaxy' | 'quasar' | 'star' | 'lyman-break';
export type SpectrumClass = TemplateClass | 'unknown';

/** Whether wavelengths are in vacuum or in standard air. */
export type Medium = 'vacuum' | 'air';

/** Descriptive metadata carried alongside the arrays. Every field is optional: files differ. */
export interface SpectrumMeta {
  /** Which reader produced the spectrum and from which part of the file (e.g. "FITS HDU 1 binary table"). */
  source: string;
  objectName?: string;
  /** Right ascension and declination in degrees. */
  ra?: number;
  dec?: number;
  instrument?: string;
  /** Exposure time in seconds. */
  exposureS?: number;
  dateObs?: string;
  /** Medium of the wavelength column as read, before any conversion. */
  medium: Medium;
  /** How the medium was decided: header keyword, a default, or a caller override. */
  mediumFrom: 'header' | 'default' | 'override';
  /** The flux unit text as the file wrote it (BUNIT, TUNITn, a header comment); see Spectrum.fluxUnit for its meaning. */
  fluxUnit?: string;
  /** True when the file had no uncertainties and ivar was estimated from local scatter. */
  errorsEstimated: boolean;
  /** Pixels dropped because the file gave them a non-finite or absurd flux or uncertainty (0 when none). */
  ignoredPixels?: number;
  /** Column or row names used for each role, for display ("flux <- FLUX", ...). */
  columns: Record<string, string>;
  /** Non-fatal remarks about the file (ignored columns, odd units...). */
  warnings: string[];
}

/** What a flux value measures: f_λ, f_ν, detector counts, a count rate, or no stated unit. */
export type FluxQuantity = 'f-lambda' | 'f-nu' | 'counts' | 'count-rate' | 'arbitrary';

/**
 * A file's flux unit, normalised: a file value × `scale` is the value in `unit` (f_λ in
 * erg s⁻¹ cm⁻² Å⁻¹, f_ν in Jy, counts as counts, ADU or electrons, rates per second). A file
 * that states no unit, or one Redward cannot read, is 'arbitrary' (scale 1): never assumed.
 */
export interface FluxUnit {
  quantity: FluxQuantity;
  scale: number;
  unit: string;
  /** The text the unit was read from; null when the file states none. */
  raw: string | null;
}

/**
 * A columnar 1D spectrum. Wavelength in Å (as read: air or vacuum per meta.medium), strictly
 * increasing; flux in the file's unit; ivar = 1/σ² in flux units⁻² (0 = no information); mask
 * 1 = bad pixel; sky in flux units when the file has one.
 */
export interface Spectrum {
  wavelength: Float64Array;
  flux: Float64Array;
  ivar: Float64Array;
  mask: Uint8Array;
  sky?: Float64Array;
  fluxUnit: FluxUnit;
  meta: SpectrumMeta;
}
