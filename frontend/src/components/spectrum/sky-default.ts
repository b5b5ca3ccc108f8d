import { robustRange } from './robust-range';
import { sampleMedian } from './sample-median';

/**
 * The sky swamps the data when its median level is more than this many times the largest
 * |flux| of the flux's robust (1–99 %) range. The plot's flux axis is that robust range, so
 * with a factor of 1 more than half of the sky curve lies beyond the top of the plot: what is left
 * on screen is a fence of clipped sky lines across the spectrum, which hides faint features
 * rather than explaining them. Below it the sky sits inside the axis and is worth seeing.
 */
export const SKY_SWAMP_FACTOR = 1;

/**
 * Whether the sky spectrum swamps the flux (SKY_SWAMP_FACTOR): then the plot starts with the sky
 * hidden, one click away. False without a sky or without usable flux.
 *
 * @example skySwampsData(Float32Array.of(-1, 0, 1), Float32Array.of(40, 50, 60), new Uint8Array(3)) // true
 */
export function skySwampsData(flux: Float32Array, sky: Float32Array | null, mask: Uint8Array): boolean {
  if (!sky) return false;
  const range = robustRange(flux, mask, 0, flux.length);
  const skyLevel = sampleMedian(sky.length, (i) => sky[i]!, (i) => mask[i] === 0);
  if (!range || skyLevel === null) return false;
  const fluxSize = Math.max(Math.abs(range[0]), Math.abs(range[1]));
  return Math.abs(skyLevel) > SKY_SWAMP_FACTOR * fluxSize;
}
