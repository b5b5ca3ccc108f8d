import { describe, expect, it } from 'vitest';
import { PHOTOZ_PRIOR_LABELS, PHOTOZ_PRIOR_NOTE, photoZPriorSource } from '../../../backend/src/services/solution-prior';

const pz = { z: [0, 1, 2], p: [0, 1, 0] };
const untyped = { photoZ: null, photoZLow: null, photoZHigh: null };

describe('photoZPriorSource: the rule exports count by and the spectrum detail ranks by', () => {
  it('takes the typed photo-z only with both ends of its range, else a computed P(z) with mass, else none', () => {
    expect(photoZPriorSource({ photoZ: 1, photoZLow: 0.9, photoZHigh: 1.1 }, pz)).toBe('typed');
    expect(photoZPriorSource({ photoZ: 1, photoZLow: null, photoZHigh: 1.1 }, pz)).toBe('computed');
    expect(photoZPriorSource(untyped, pz)).toBe('computed');
    expect(photoZPriorSource(untyped, { z: [0, 1], p: [0, 0] })).toBe('none');
    expect(photoZPriorSource(untyped, null)).toBe('none');
    expect(photoZPriorSource(null, pz)).toBe('none');
  });

  it('names the three priors in the note as exports write them', () => {
    expect(PHOTOZ_PRIOR_NOTE.startsWith(`photo-z prior: ${Object.values(PHOTOZ_PRIOR_LABELS).join(' | ')}.`)).toBe(true);
    // FITS COMMENT cards carry it: printable ASCII only.
    expect(/^[\x20-\x7e]+$/.test(PHOTOZ_PRIOR_NOTE)).toBe(true);
  });
});
