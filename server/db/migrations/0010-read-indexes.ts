import type { QueryInterface } from 'sequelize';

/**
 * Indexes for the reads the pages make: the paged staff lists (newest first, by maker, by status),
 * the per-pledge and per-need counts, and the intake queue's events of a kind on a day.
 */
const INDEXES: Array<{ table: string; fields: string[]; name: string }> = [
  { table: 'blankets', fields: ['pledgeId', 'status'], name: 'blankets_pledge_status' },
  { table: 'blankets', fields: ['createdAt'], name: 'blankets_created_at' },
  { table: 'blankets', fields: ['userId', 'createdAt'], name: 'blankets_user_created_at' },
  { table: 'blankets', fields: ['status', 'createdAt'], name: 'blankets_status_created_at' },
  { table: 'blankets', fields: ['siteId', 'status', 'receivedAt'], name: 'blankets_site_status_received' },
  { table: 'blanket_events', fields: ['kind', 'createdAt'], name: 'blanket_events_kind_created_at' },
  { table: 'pledges', fields: ['needId', 'status', 'quantity'], name: 'pledges_need_status_quantity' },
  { table: 'pledges', fields: ['dueDate'], name: 'pledges_due_date' },
  { table: 'pledges', fields: ['userId', 'dueDate'], name: 'pledges_user_due_date' },
  { table: 'needs', fields: ['deadline'], name: 'needs_deadline' },
];

export async function up({ context: qi }: { context: QueryInterface }) {
  for (const i of INDEXES) await qi.addIndex(i.table, i.fields, { name: i.name });
  // Fresh statistics let SQLite's planner choose between these and the older single-column indexes.
  await qi.sequelize.query('ANALYZE;');
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const i of [...INDEXES].reverse()) await qi.removeIndex(i.table, i.name);
}
