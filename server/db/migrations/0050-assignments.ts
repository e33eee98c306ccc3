import { DataTypes, type QueryInterface } from 'sequelize';

const fk = (model: string, allowNull: boolean, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT') => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
});

/**
 * An assignment: this blanket goes to this need (and so to its recipient), chosen by this person
 * at this time. Ended rows stay as the record of earlier choices; the partial unique index keeps
 * one live assignment per blanket whatever the application does.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('assignments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    blanketId: fk('blankets', false, 'CASCADE'),
    needId: fk('needs', false, 'RESTRICT'),
    recipientId: fk('recipients', false, 'RESTRICT'),
    assignedById: fk('users', true, 'SET NULL'),
    assignedAt: { type: DataTypes.DATE, allowNull: false },
    /** Where the blanket was meant to go before, given back to it when the assignment ends. */
    priorRecipientId: fk('recipients', true, 'SET NULL'),
    /** 'board' for one chosen by hand, 'suggestion' for one accepted from the solver. */
    source: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'board' },
    endedAt: { type: DataTypes.DATE, allowNull: true },
    endedById: fk('users', true, 'SET NULL'),
    endReason: { type: DataTypes.STRING(500), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('assignments', ['blanketId'], { name: 'assignments_live_blanket', unique: true, where: { endedAt: null } });
  await qi.addIndex('assignments', ['needId', 'endedAt'], { name: 'assignments_need_live' });
  await qi.addIndex('assignments', ['recipientId', 'endedAt'], { name: 'assignments_recipient_live' });
  // Blankets already past "checked" were assigned by a bare status change to their pledge's need:
  // give each of them the record it would have had, so need counts and capacity include them.
  await qi.sequelize.query(`
    INSERT INTO assignments (blanketId, needId, recipientId, assignedById, assignedAt, priorRecipientId, source, version, createdAt, updatedAt)
    SELECT b.id, p.needId, n.recipientId, NULL, b.updatedAt, b.recipientId, 'board', 0, b.updatedAt, b.updatedAt
    FROM blankets b JOIN pledges p ON p.id = b.pledgeId JOIN needs n ON n.id = p.needId
    WHERE b.status IN ('assigned', 'packed', 'delivered')`);
  await qi.sequelize.query(`
    UPDATE blankets SET recipientId = (SELECT a.recipientId FROM assignments a WHERE a.blanketId = blankets.id AND a.endedAt IS NULL)
    WHERE id IN (SELECT blanketId FROM assignments WHERE endedAt IS NULL)`);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('assignments');
}
