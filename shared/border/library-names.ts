/**
 * The border library's names, on their own: a form that only offers a choice of border loads
 * these and none of the patterns' numbers and instructions. ./library.ts takes its names from here.
 */
export const BORDER_NAMES = {
  'five-dc-shell': 'Five-dc shell',
  'picot-tipped-shell': 'Shell with picot tips',
  'crab-stitch-edge': 'Crab-stitch edge',
  'plain-hdc-round': 'Plain hdc round',
  'wide-scallop': 'Wide scallop',
  'picot-ribbon': 'Picot ribbon',
  'open-v-lattice': 'Open V lattice',
  'bobble-dots': 'Bobble dots',
} as const;

export type BorderId = keyof typeof BORDER_NAMES;

/** The library's borders as choices, in the library's order. */
export const BORDER_CHOICES: ReadonlyArray<{ id: BorderId; name: string }> = Object.entries(BORDER_NAMES).map(([id, name]) => ({ id: id as BorderId, name }));
