/**
 * Redward's inspection key map, as data: the handler and the help overlay read the same table,
 * so what the overlay says is what the keys do. Letters follow the trade's words (t = take,
 * n/p = next/previous solution, f = frame, m = smoothing); a digit is the grade at that place in the scheme (or the grade with that digit code in older schemes).
 */
export interface KeyBinding {
  keys: string[];
  does: string;
}

export interface KeyGroup {
  title: string;
  bindings: KeyBinding[];
}

export const KEY_MAP: KeyGroup[] = [
  {
    title: 'Confirm fast',
    bindings: [
      { keys: ['t'], does: 'Take the top solution: comb, class and lines' },
      { keys: ['Shift', '0–9'], does: 'Grade with that code, save and open the next spectrum' },
      { keys: ['Enter'], does: 'Save the reading and open the next spectrum' },
    ],
  },
  {
    title: 'Comb and redshift',
    bindings: [
      { keys: ['←', '→'], does: 'Nudge the comb by one pixel in velocity' },
      { keys: ['Shift', '←', '→'], does: 'Nudge by ten pixels' },
      { keys: ['n', 'p'], does: 'Next / previous solution' },
      { keys: ['z'], does: 'Type a trial redshift' },
    ],
  },
  {
    title: 'Reading',
    bindings: [
      { keys: ['1–9'], does: 'Set the grade at that place in the scheme (1 = most confident; a digit code in older schemes)' },
      { keys: ['g'], does: 'Class: galaxy' },
      { keys: ['q'], does: 'Class: quasar / AGN' },
      { keys: ['s'], does: 'Class: star' },
      { keys: ['b'], does: 'Class: Lyman-break source' },
      { keys: ['u'], does: 'Class: unknown' },
      { keys: ['e'], does: 'Edit the note' },
    ],
  },
  {
    title: 'Queue',
    bindings: [
      { keys: [']'], does: 'Next spectrum' },
      { keys: ['['], does: 'Previous spectrum' },
    ],
  },
  {
    title: 'View',
    bindings: [
      { keys: ['m'], does: 'Smoothing on / off' },
      { keys: ['f'], does: 'Rest-frame / observed axis' },
      { keys: ['+', '−'], does: 'Zoom in / out' },
      { keys: [',', '.'], does: 'Pan left / right' },
      { keys: ['r'], does: 'Reset zoom' },
      { keys: ['d'], does: 'Drag tool: comb ⇄ zoom' },
      { keys: ['?'], does: 'Show or hide this key map' },
    ],
  },
];
