/** Storage kinds that every writer knows how to map onto its own type system. */
export type ColumnKind = 'int' | 'long' | 'double' | 'string';

/** One column of the confirmed-redshift export, described once for all formats. */
export interface ExportColumn {
  name: string;
  kind: ColumnKind;
  /** Unit string valid in VOUnits, FITS and astropy alike; absent for dimensionless values. */
  unit?: string;
  /** IVOA UCD1+ (ucd-list.txt v1.5); words chosen so primary-only words lead and secondary-only follow. */
  ucd: string;
  description: string;
}

/**
 * The columns, in file order. Names are snake_case so they are legal as astropy column names,
 * FITS TTYPE values and VOTable FIELD names without quoting. List-valued fields (lines, readers)
 * are joined with ';'; an element that itself contains ';' is not escaped.
 */
export const CONFIRMED_COLUMNS: readonly ExportColumn[] = [
  { name: 'record_id', kind: 'long', ucd: 'meta.record', description: 'Id of this confirmed record' },
  { name: 'target_id', kind: 'string', ucd: 'meta.id;meta.main', description: 'Catalogue id of the target' },
  { name: 'spectrum_id', kind: 'long', ucd: 'meta.id', description: 'Id of the spectrum in the campaign' },
  { name: 'file_name', kind: 'string', ucd: 'meta.id;meta.file', description: 'Name of the uploaded spectrum file' },
  { name: 'ra', kind: 'double', unit: 'deg', ucd: 'pos.eq.ra;meta.main', description: 'Right ascension, J2000' },
  { name: 'dec', kind: 'double', unit: 'deg', ucd: 'pos.eq.dec;meta.main', description: 'Declination, J2000' },
  { name: 'z', kind: 'double', ucd: 'src.redshift', description: 'Confirmed spectroscopic redshift (vacuum wavelengths)' },
  { name: 'z_err', kind: 'double', ucd: 'stat.error;src.redshift', description: 'One-sigma uncertainty of z' },
  {
    name: 'z_err_floor',
    kind: 'double',
    ucd: 'stat.error;src.redshift;stat.min',
    description: 'Smallest z_err the data allow: sigma of the resolution element at z (2 pixels FWHM from the pixel scale)',
  },
  { name: 'grade_code', kind: 'string', ucd: 'meta.code.qual', description: 'Grade code in the campaign grade scheme' },
  { name: 'grade_label', kind: 'string', ucd: 'meta.code.qual', description: 'Grade label in the campaign grade scheme' },
  { name: 'class', kind: 'string', ucd: 'src.class', description: 'Class: galaxy, quasar, star, lyman-break or unknown' },
  { name: 'lines', kind: 'string', ucd: 'meta.id;spect.line', description: "Features supporting z, separated by ';'" },
  {
    name: 'lines_measured',
    kind: 'string',
    ucd: 'meta.note;spect.line',
    description: "Lines with their measurements, name:flux=v+/-e:sn=S:dv=km/s (ew= rest A, ratio= for breaks), separated by ';'",
  },
  { name: 'line_flux_unit', kind: 'string', ucd: 'meta.unit', description: 'Unit of the line fluxes in lines_measured' },
  { name: 'z_caveat', kind: 'string', ucd: 'meta.note;src.redshift', description: 'Caveat on z, e.g. when it rests on Lya alone' },
  { name: 'photo_z', kind: 'double', ucd: 'src.redshift.phot', description: 'Photometric redshift of the target' },
  { name: 'photo_z_low', kind: 'double', ucd: 'src.redshift.phot;stat.min', description: 'Lower end of the 68% photometric redshift range' },
  { name: 'photo_z_high', kind: 'double', ucd: 'src.redshift.phot;stat.max', description: 'Upper end of the 68% photometric redshift range' },
  { name: 'image_family', kind: 'string', ucd: 'meta.id.parent', description: 'Lensed source whose multiple images share this family' },
  { name: 'readers', kind: 'string', ucd: 'meta.id', description: "People whose readings back z, separated by ';'" },
  { name: 'confirmed_by', kind: 'string', ucd: 'meta.code.status', description: 'How z was confirmed: agreement, settlement or correction' },
  { name: 'confirmed_at', kind: 'string', ucd: 'time.creation', description: 'When the record was confirmed, ISO-8601 UTC' },
  { name: 'supersedes', kind: 'long', ucd: 'meta.record', description: 'Id of the confirmed record this one corrects' },
  {
    name: 'lookback_time',
    kind: 'double',
    unit: 'Gyr',
    ucd: 'time.interval;phys.cosmology',
    description: 'Lookback time to z under the stated cosmology; 0 for z <= 0',
  },
  {
    name: 'luminosity_distance',
    kind: 'double',
    unit: 'Mpc',
    ucd: 'pos.distance;phys.cosmology',
    description: 'Luminosity distance under the stated cosmology; null for z <= 0',
  },
  {
    name: 'interloper_z',
    kind: 'double',
    ucd: 'src.redshift;stat.fit.param',
    description: 'Lyman-break records: redshift of the best 4000 A/Balmer-break galaxy at the mirror redshift',
  },
  {
    name: 'interloper_dchi2',
    kind: 'double',
    ucd: 'stat.fit.chi2',
    description: 'Lyman-break records: chi2 of that break galaxy minus chi2 of the Lyman break (> 0 favours the Lyman break)',
  },
  {
    name: 'star_dchi2',
    kind: 'double',
    ucd: 'stat.fit.chi2',
    description: 'Lyman-break records: smallest chi2 of a cool-star, brown-dwarf or carbon-star template at z = 0 minus chi2 of the Lyman break',
  },
  { name: 'z_phot', kind: 'double', ucd: 'src.redshift.phot', description: 'Photometric redshift computed by Redward from the catalogue fluxes (best z)' },
  { name: 'z_phot_low', kind: 'double', ucd: 'src.redshift.phot;stat.min', description: 'Lower end of the 68% interval of the computed P(z)' },
  { name: 'z_phot_high', kind: 'double', ucd: 'src.redshift.phot;stat.max', description: 'Upper end of the 68% interval of the computed P(z)' },
  { name: 'z_phot_p_low_z', kind: 'double', ucd: 'stat.probability', description: 'Probability that z < 2 under the computed P(z) (low-redshift interloper odds)' },
];
