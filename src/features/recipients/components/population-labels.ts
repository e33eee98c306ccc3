import type { Population } from '../../../../shared/schemas/blanket';

export const POPULATION_LABELS: Record<Population, string> = {
  preemie: 'Premature and newborn babies',
  infant: 'Babies and toddlers',
  child: 'Children',
  teen: 'Teenagers',
  adult: 'Adults',
  elder: 'Older people in care',
};
