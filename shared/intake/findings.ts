import { CHECKLIST_ITEMS, type Checklist } from '../schemas/intake';

/** What the drop-off table found, in the words the maker reads: the checklist first, then the guidelines. */
export function findingsOf(checklist: Partial<Checklist> | null | undefined, ruleMessages: readonly string[]): string[] {
  const failed = CHECKLIST_ITEMS.filter((item) => checklist && checklist[item.key] === false);
  return [...failed.map((item) => `Not so: ${item.label.toLowerCase()}.`), ...ruleMessages];
}
