import type { GlanceStep } from '@shared/drive/glance';
import { weekAfter } from '@shared/drive/glance';

/** The lists behind the figures of the drive at a glance: the staff blanket list with its filters. */
export const glanceLinks = {
  step: (step: GlanceStep, needId?: number) => `/all-blankets?step=${step}${needId ? `&needId=${needId}` : ''}`,
  reached: (step: GlanceStep, week: string, needId?: number) => `/all-blankets?reached=${step}&from=${week}&to=${weekAfter(week)}${needId ? `&needId=${needId}` : ''}`,
  /** Pledges still standing (active or made): the ones the pledged figures add up. */
  pledged: (needId?: number, week?: string) =>
    `/all-pledges?promising=true${needId ? `&needId=${needId}` : ''}${week ? `&from=${week}&to=${weekAfter(week)}` : ''}`,
  recipient: (recipientId: number) => `/recipients/${recipientId}`,
  blanket: (id: number) => `/blankets/${id}`,
  run: (id: number) => `/runs/${id}`,
};
