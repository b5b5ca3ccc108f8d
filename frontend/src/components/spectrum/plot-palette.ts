/**
 * Canvas colours of the inspection plots, taken from the design tokens in styles/app.css (a canvas
 * cannot read CSS variables cheaply per frame). Emission features burn in ember (the red end),
 * absorption features sit in the cool blue, broad bands and breaks in the neutral ink.
 */
export const PLOT = {
  flux: '#151d31',
  errorBand: 'rgba(93, 140, 188, 0.28)',
  sky: 'rgba(140, 148, 173, 0.75)',
  mask: 'rgba(168, 49, 43, 0.16)',
  labelGround: 'rgba(255, 253, 248, 0.85)',
  maskEdge: 'rgba(168, 49, 43, 0.35)',
  grid: '#efe8d9',
  axis: '#4f5a78',
  emission: '#b7461b',
  absorption: '#2f5985',
  band: 'rgba(55, 65, 93, 0.16)',
  bandLine: '#37415d',
  break: '#0d1322',
  peak: '#2c623d',
  // The best-fit template of a solution: green, apart from the flux's ink and the combs' ember/blue.
  model: '#2c8a52',
  cursor: '#d4592a',
  solution: '#37415d',
  // The two readings of a disagreement, each comb in one colour (kinds told apart by dash).
  readingFirst: '#b7461b',
  readingSecond: '#2f5985',
  // Reference lines in charts (z = photo-z), quieter than any data.
  reference: '#b3b9cb',
  classes: {
    galaxy: '#b7461b',
    quasar: '#2f5985',
    star: '#7d5a0c',
    'lyman-break': '#2c623d',
  } as Record<string, string>,
} as const;

export const LABEL_FONT = '10px "IBM Plex Mono", ui-monospace, monospace';
