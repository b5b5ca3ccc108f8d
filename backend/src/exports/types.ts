/** Classes a confirmed redshift can carry (PRODUCT.md vocabulary). */
export type SpectrumClass = 'galaxy' | 'quasar' | 'star' | 'lyman-break' | 'unknown';

/** One line of a confirmed value with its measurement (the quantity that decides detection). */
export interface ExportLine {
  name: string;
  measure: 'flux' | 'ew' | 'break';
  /** flux (line_flux_unit), rest-frame EW (Å; negative = absorption) or break ratio; null when not measured. */
  value: number | null;
  error: number | null;
  snr: number | null;
  /** Centroid minus the comb's position, km/s (detected emission lines only). */
  offsetKms: number | null;
  detected: boolean;
  /** Other lines measured together with this one (unresolved). */
  blendedWith: string[];
}

/** One released redshift, as the export writers receive it (the lead maps database rows onto this). */
export interface ConfirmedRow {
  /** Catalogue id of the target, if the spectrum is linked to one. */
  targetId: string | null;
  spectrumId: number;
  fileName: string;
  /** Degrees, J2000. */
  ra: number | null;
  dec: number | null;
  z: number;
  zErr: number | null;
  gradeCode: string;
  gradeLabel: string;
  spectrumClass: SpectrumClass;
  /** Names of the features that support the redshift. */
  lines: string[];
  /** The measurements of those lines that fall on the data (empty for records saved before lines were measured). */
  lineMeasurements: ExportLine[];
  /** Unit of the line fluxes, e.g. "erg s⁻¹ cm⁻²" or "arbitrary × Å"; null when nothing was measured. */
  lineFluxUnit: string | null;
  /** The smallest error the data allow: the σ of the resolution element at z; null when not known. */
  zErrFloor: number | null;
  photoZ: number | null;
  /** Lower and upper ends of the photometric redshift's 68 % range. */
  photoZLow: number | null;
  photoZHigh: number | null;
  imageFamily: string | null;
  /** Names of the people whose readings back this value. */
  readers: string[];
  confirmedBy: 'agreement' | 'settlement' | 'correction';
  /** ISO-8601 UTC. */
  confirmedAt: string;
  /** Id of the confirmed record this one corrects. */
  supersedes: number | null;
  /**
   * Lyman-break records: the interloper check of the engine's solution at this z — the mirror
   * redshift of the best 4000 Å/Balmer-break galaxy, its Δχ² against the Lyman break, and the
   * smallest Δχ² of the cool-star, brown-dwarf and carbon-star templates (null otherwise).
   */
  interloperZ: number | null;
  interloperDeltaChi2: number | null;
  starDeltaChi2: number | null;
  /**
   * The target's photometric redshift computed from its catalogue fluxes (not the catalogue's
   * typed photo_z): best z, 68 % interval, P(z < 2). Absent or null when it has no photometry.
   */
  zPhot?: number | null;
  zPhotLow?: number | null;
  zPhotHigh?: number | null;
  zPhotPLowZ?: number | null;
  /** Id of this confirmed record. */
  id: number;
}

/** Everything a reader of an export needs to interpret the numbers; written into every format. */
export interface ExportAssumptions {
  campaign: string;
  wavelengths: 'vacuum';
  cosmology: { name: string; h0: number; omegaM: number; omegaLambda: number; flat: true };
  /** Agreement tolerance on |Δz|/(1+z). */
  tolerance: number;
  gradeScheme: { code: string; label: string; meaning: string }[];
  /** ISO-8601 UTC. */
  exportedAt: string;
  /** e.g. "Redward 0.1.0 / redward-engine/0.2.0". */
  software: string;
  /** How the z_phot columns were computed: the filter set(s) and the template set, in words. */
  photometricRedshift?: { filters: string; templates: string; method: string };
  /**
   * Which photo-z prior ranks the engine's solutions that readers see (the convention, in words),
   * and how many of the campaign's current confirmed records fall under each, at export time.
   */
  photoZPrior?: { convention: string; records: { typed: number; computed: number; none: number } };
}

/** A member of an image family that has no confirmed redshift yet. */
export interface UnconfirmedMember {
  imageFamily: string;
  targetId: string | null;
  spectrumId: number | null;
  /** The open disagreement holding it back, if any: where a lead goes to settle it. */
  openDisagreementId?: number | null;
}
