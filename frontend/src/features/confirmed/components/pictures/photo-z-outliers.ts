/** The usual photo-z outlier cut: |z_spec − z_phot|/(1 + z_spec) > 0.15 (a common convention in photo-z work, not a Redward choice). */
export const OUTLIER_CUT = 0.15;

export interface PhotoZComparison {
  /** Columnar, sorted by photo-z: x = photo-z, inliers and outliers as separate series (NaN where the other holds the point). */
  photoZ: Float64Array;
  inlier: Float64Array;
  outlier: Float64Array;
  outliers: number;
  compared: number;
}

/** Pairs each confirmed z with its target's photo-z; rows without a photo-z are not compared. */
export function comparePhotoZ(rows: ReadonlyArray<{ z: number; photoZ: number | null }>): PhotoZComparison {
  const pairs = rows.filter((r): r is { z: number; photoZ: number } => r.photoZ !== null).sort((a, b) => a.photoZ - b.photoZ);
  const n = pairs.length;
  const photoZ = new Float64Array(n);
  const inlier = new Float64Array(n);
  const outlier = new Float64Array(n);
  let outliers = 0;
  for (let i = 0; i < n; i++) {
    const { z, photoZ: p } = pairs[i]!;
    photoZ[i] = p;
    const out = Math.abs(z - p) / (1 + z) > OUTLIER_CUT;
    if (out) outliers++;
    inlier[i] = out ? Number.NaN : z;
    outlier[i] = out ? z : Number.NaN;
  }
  return { photoZ, inlier, outlier, outliers, compared: n };
}
