export interface LinkableTarget {
  id: number;
  catalogueId: string;
  ra: number | null;
  dec: number | null;
}

export interface SpectrumIdentity {
  fileName: string;
  objectName?: string | undefined;
  ra?: number | undefined;
  dec?: number | undefined;
}

export type TargetLink = { targetId: number; method: 'file-name' | 'object-keyword' | 'position'; separationArcsec?: number };

/**
 * Finds the catalogue target a spectrum belongs to, in the order a person would trust:
 * the catalogue id in the file name, then the OBJECT keyword, then the nearest catalogue
 * position within the tolerance. Ids match only as whole tokens ("LNT-12" is not found in
 * "LNT-123"); when several ids match, the longest wins.
 */
export function linkTarget(targets: readonly LinkableTarget[], spectrum: SpectrumIdentity, toleranceArcsec: number): TargetLink | null {
  const baseName = spectrum.fileName.split('/').pop() ?? spectrum.fileName;
  const byName = longestTokenMatch(targets, baseName);
  if (byName) return { targetId: byName.id, method: 'file-name' };
  if (spectrum.objectName) {
    const byObject = targets.find((t) => sameId(t.catalogueId, spectrum.objectName!)) ?? longestTokenMatch(targets, spectrum.objectName);
    if (byObject) return { targetId: byObject.id, method: 'object-keyword' };
  }
  if (spectrum.ra !== undefined && spectrum.dec !== undefined && Number.isFinite(spectrum.ra) && Number.isFinite(spectrum.dec)) {
    let best: { target: LinkableTarget; sep: number } | null = null;
    for (const t of targets) {
      if (t.ra === null || t.dec === null) continue;
      const sep = angularSeparationArcsec(spectrum.ra, spectrum.dec, t.ra, t.dec);
      if (sep <= toleranceArcsec && (!best || sep < best.sep)) best = { target: t, sep };
    }
    if (best) return { targetId: best.target.id, method: 'position', separationArcsec: best.sep };
  }
  return null;
}

function sameId(a: string, b: string): boolean {
  return a.trim().toLowerCase() === b.trim().toLowerCase();
}

function longestTokenMatch(targets: readonly LinkableTarget[], text: string): LinkableTarget | null {
  const haystack = text.toLowerCase();
  let best: LinkableTarget | null = null;
  for (const t of targets) {
    const id = t.catalogueId.trim().toLowerCase();
    if (id.length === 0 || (best && id.length <= best.catalogueId.trim().length)) continue;
    if (containsToken(haystack, id)) best = t;
  }
  return best;
}

const isIdChar = (c: string | undefined) => c !== undefined && /[a-z0-9]/.test(c);

function containsToken(haystack: string, id: string): boolean {
  for (let at = haystack.indexOf(id); at !== -1; at = haystack.indexOf(id, at + 1)) {
    if (!isIdChar(haystack[at - 1]) && !isIdChar(haystack[at + id.length])) return true;
  }
  return false;
}

/** Great-circle distance by the haversine formula (stable at small separations), arcseconds. */
export function angularSeparationArcsec(ra1: number, dec1: number, ra2: number, dec2: number): number {
  const rad = Math.PI / 180;
  const dDec = (dec2 - dec1) * rad;
  const dRa = (ra2 - ra1) * rad;
  const h = Math.sin(dDec / 2) ** 2 + Math.cos(dec1 * rad) * Math.cos(dec2 * rad) * Math.sin(dRa / 2) ** 2;
  return (2 * Math.asin(Math.min(1, Math.sqrt(h))) * 180 * 3600) / Math.PI;
}
