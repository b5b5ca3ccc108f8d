/** What a column of a table (FITS or text) carries. */
export type ColumnRole = 'wavelength' | 'logWavelength' | 'flux' | 'error' | 'ivar' | 'variance' | 'mask' | 'sky';

/**
 * Guesses a column's role from its name (case-insensitive), e.g. "loglam" → logWavelength,
 * "ERR_FLUX" → error, "and_mask" → mask. Returns undefined for columns we do not use
 * (models, continua, resolution...). Order matters: the most specific patterns come first.
 */
export function columnRole(name: string): ColumnRole | undefined {
  const n = name.trim().toLowerCase().replace(/[\s\-.]+/g, '_');
  if (/(^|_)(model|continuum|cont|wdisp|resolution|disp|npix|or_mask)($|_)/.test(n)) return undefined;
  // A telluric transmission column is not the object; a telluric-corrected flux or error is.
  if (/(^|_)(tell|telluric|telluric_?trans(mission)?|atm_?trans(mission)?)($|_)/.test(n) && !isTelluricCorrected(n)) return undefined;
  if (/^(log_?lam(bda)?|log_?wave?(length)?|loglambda|lgwave)$/.test(n)) return 'logWavelength';
  if (/^(wave|wavelength|wavelengths|lambda|lam|wl|wav|awav|vac_?wave|air_?wave|wave_?(air|vac)|lambda_?(air|vac)|w)$/.test(n)) return 'wavelength';
  if (/(^|_)(ivar|inv_?var|invvar|inverse_?variance|weight)($|_)/.test(n)) return 'ivar';
  if (/^(var|variance|flux_?var)$/.test(n)) return 'variance';
  if (/(^|_)(err|error|errors|sigma|sig|unc|uncertainty|noise|properr|ferr|e_?flux|flux_?err|std|stddev|rms)($|_)/.test(n) || /err$/.test(n)) return 'error';
  if (/(^|_)(and_?mask|mask|badpix|bpm|flag|flags|quality|dq)($|_)/.test(n)) return 'mask';
  if (/(^|_)(sky|background|bkg)($|_)/.test(n)) return 'sky';
  if (/^(flux|flam|f_?lambda|fnu|f_?nu|spec|spectrum|counts|intensity|fl|f|flux_?density|weighted_?mean)$/.test(n) || /^flux/.test(n)) return 'flux';
  return undefined;
}

function isTelluricCorrected(n: string): boolean {
  return /tell?(uric)?_?corr|tel_?cor/.test(n) && !/no_?corr|uncorr/.test(n);
}

/**
 * How much a column is preferred among columns of the same role: a telluric-corrected flux or error
 * (e.g. FLUX_TELL_CORR next to FLUX) beats the plain one, which beats an explicitly uncorrected one
 * (FLUX_NOCORR): readers want the corrected near-infrared spectrum when the file carries both.
 */
export function columnPreference(name: string): number {
  const n = name.trim().toLowerCase().replace(/[\s\-.]+/g, '_');
  if (isTelluricCorrected(n)) return 2;
  if (/no_?corr|uncorr/.test(n)) return 0;
  return 1;
}

/**
 * Converts a wavelength unit string to the factor that turns it into Å; undefined when the string
 * names no length unit we know. Accepts FITS spellings (Angstrom, nm, um, m) and common variants.
 */
export function angstromsPer(unit: string): number | undefined {
  const u = unit.trim().toLowerCase().replace(/[()[\]{}]/g, '');
  if (u === '') return undefined;
  if (/^(a|aa|å|angstrom|angstroms|ang|angs|0\.1nm)$/.test(u)) return 1;
  if (/^(nm|nanometer|nanometers|nanometre|nanometres)$/.test(u)) return 10;
  if (/^(um|µm|μm|micron|microns|micrometer|micrometers|micrometre)$/.test(u)) return 1e4;
  if (/^(m|meter|meters|metre|metres)$/.test(u)) return 1e10;
  if (/^(cm)$/.test(u)) return 1e8;
  return undefined;
}

/** Finds a unit mentioned inside a column name such as "wave(A)", "lambda[nm]" or "wl_um". */
export function unitInName(name: string): number | undefined {
  const bracket = /[([{]\s*([^)\]}]+?)\s*[)\]}]/.exec(name);
  if (bracket) {
    const f = angstromsPer(bracket[1]!);
    if (f !== undefined) return f;
  }
  const tail = /[_\s](a|aa|angstrom|nm|um|micron)$/i.exec(name.trim());
  return tail ? angstromsPer(tail[1]!) : undefined;
}

/**
 * Last-resort unit guess from the median wavelength value when nothing declares one: values below
 * 30 are taken as µm (no optical spectrum sits below 30 Å), values below 1e-3 as metres, else Å.
 * nm is never guessed: 300–3000 is a legitimate UV range in Å.
 */
export function guessAngstromsPer(medianValue: number): number {
  if (medianValue < 1e-3) return 1e10;
  if (medianValue < 30) return 1e4;
  return 1;
}
