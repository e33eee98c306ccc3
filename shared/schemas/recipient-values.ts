/**
 * The kinds of place that receive blankets and their names, without zod: a page that only shows or lists these values loads none of the schema
 * library. ./recipient.ts re-exports them, so the server and the schemas keep importing from there.
 */

/** The kinds of place that receive blankets; `other` covers what the list does not name. */
export const RECIPIENT_KINDS = ['neonatal-unit', 'childrens-ward', 'family-shelter', 'care-home', 'hospice', 'other'] as const;

export const RECIPIENT_KIND_LABELS: Record<(typeof RECIPIENT_KINDS)[number], string> = {
  'neonatal-unit': 'Newborn unit',
  'childrens-ward': "Children's ward",
  'family-shelter': 'Family shelter',
  'care-home': 'Care home',
  hospice: 'Hospice',
  other: 'Other',
};
