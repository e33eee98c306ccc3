import type { QueryInterface } from 'sequelize';

/**
 * A blanket's latest "checked" step, who made it and when, read from the index alone: the delivery
 * manifest asks it for every row, and fetching each history entry from the table (its record of the
 * check is large) was about half of SQLite's work for a manifest. The index holds what 0091's held,
 * in the same order, so the drive at a glance reads it as before; 0091's is dropped.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('blanket_events', ['blanketId', 'toStatus', 'createdAt', 'id', 'actorId'], { name: 'blanket_events_blanket_to_created_actor' });
  await qi.removeIndex('blanket_events', 'blanket_events_blanket_to_created');
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('blanket_events', ['blanketId', 'toStatus', 'createdAt'], { name: 'blanket_events_blanket_to_created' });
  await qi.removeIndex('blanket_events', 'blanket_events_blanket_to_created_actor');
}
