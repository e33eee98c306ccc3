import type { QueryInterface } from 'sequelize';

/**
 * The drive at a glance asks, for each blanket at a step, when the history brought it to its present
 * status, and its lists ask which blankets reached a step in a week: both read a blanket's history by
 * its status, in time order.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('blanket_events', ['blanketId', 'toStatus', 'createdAt'], { name: 'blanket_events_blanket_to_created' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('blanket_events', 'blanket_events_blanket_to_created');
}
