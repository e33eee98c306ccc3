import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './test-app';

let t: TestApp;

beforeAll(async () => {
  t = await makeTestApp({ seed: false });
});
afterAll(async () => t.close());

/**
 * The migrations write the schema and the models describe it again, by design (DEVELOPERS.md). This
 * keeps the two from drifting apart: an empty database migrated from scratch must have, for every
 * model, exactly the model's columns, with the same primary key and, where the model says, nullability.
 */
describe('migrations and models agree', () => {
  it('every model has a table, and every table column is one of its attributes and back', async () => {
    const qi = t.sequelize.getQueryInterface();
    const models = Object.values(t.sequelize.models);
    expect(models.length).toBeGreaterThan(8);
    const problems: string[] = [];
    for (const model of models) {
      const table = model.getTableName() as string;
      let columns: Awaited<ReturnType<typeof qi.describeTable>>;
      try {
        columns = await qi.describeTable(table);
      } catch {
        problems.push(`${model.name}: the migrations create no table "${table}"`);
        continue;
      }
      const attributes = Object.values(model.getAttributes());
      const fields = new Map(attributes.map((a) => [a.field ?? '', a]));
      for (const name of Object.keys(columns)) {
        if (!fields.has(name)) problems.push(`${table}.${name}: a column the model ${model.name} does not declare`);
      }
      for (const [field, a] of fields) {
        const c = columns[field];
        if (!c) {
          problems.push(`${table}.${field}: declared by ${model.name} but no migration creates it`);
          continue;
        }
        // Nullability is compared where the model states it; timestamps and the foreign keys added by
        // associations leave it to the table, and Sequelize fills the timestamps itself.
        if ((a.allowNull === undefined || a.references) && !a.primaryKey) continue;
        const modelNullable = a.primaryKey ? false : a.allowNull !== false;
        const tableNullable = c.primaryKey ? false : c.allowNull;
        if (modelNullable !== tableNullable) {
          problems.push(`${table}.${field}: the model says ${modelNullable ? 'nullable' : 'NOT NULL'}, the table ${tableNullable ? 'nullable' : 'NOT NULL'}`);
        }
        if (Boolean(a.primaryKey) !== Boolean(c.primaryKey)) problems.push(`${table}.${field}: primary key in one and not the other`);
      }
    }
    expect(problems).toEqual([]);
  });

  it('finds a column a model lacks (the check itself works)', async () => {
    const qi = t.sequelize.getQueryInterface();
    const columns = await qi.describeTable('blankets');
    const declared = new Set(Object.values(t.sequelize.models.Blanket!.getAttributes()).map((a) => a.field));
    expect(Object.keys(columns).every((c) => declared.has(c))).toBe(true);
    expect(declared.has('measuredWidthCm')).toBe(true);
    await qi.addColumn('blankets', 'strayColumn', { type: 'TEXT', allowNull: true });
    const after = await qi.describeTable('blankets');
    expect(Object.keys(after).filter((c) => !declared.has(c))).toEqual(['strayColumn']);
    await qi.removeColumn('blankets', 'strayColumn');
  });
});
