import type { FindOptions, IncludeOptions, Model, ModelStatic } from 'sequelize';

/**
 * `Model.findAll` for read-only lists, answering plain objects instead of model instances.
 *
 * Building instances is most of what a list costs: at 25 blankets with their maker and recipient,
 * Sequelize spends about twice the CPU on instances (setters, change tracking, grouping the joined
 * columns) than on the query itself. This runs the same query with `raw` and `nest`, then gives the
 * values the types the instances would have had (SQLite keeps booleans as 0/1, JSON and dates as
 * text). The result has the same fields as `instance.get({ plain: true })`.
 *
 * Only includes that are one row per row (belongsTo, hasOne) are allowed: `raw` would repeat the
 * parent for each row of a hasMany, so those are refused rather than answered wrong.
 */
export async function findAllPlain<T>(model: ModelStatic<Model>, options: FindOptions): Promise<T[]> {
  const rows = (await model.findAll({ ...options, raw: true, nest: true })) as unknown as Record<string, unknown>[];
  const includes = normalise(model, options.include);
  return rows.map((row) => hydrate(model, row, includes) as T);
}

interface Included {
  as: string;
  model: ModelStatic<Model>;
  include: Included[];
}

function normalise(parent: ModelStatic<Model>, include: FindOptions['include']): Included[] {
  if (!include) return [];
  const list = Array.isArray(include) ? include : [include];
  return list.map((i) => {
    const o = i as IncludeOptions;
    if (!o.model || !o.as) throw new Error(`findAllPlain needs { model, as } for each include of ${parent.name}`);
    const association = parent.associations[o.as];
    if (!association || association.isMultiAssociation) {
      throw new Error(`findAllPlain cannot include ${parent.name}.${o.as}: only one-row associations keep their shape in raw rows`);
    }
    const model = o.model as ModelStatic<Model>;
    return { as: o.as, model, include: normalise(model, o.include) };
  });
}

type Parse = (value: unknown) => unknown;

const parsers = new WeakMap<ModelStatic<Model>, Map<string, Parse>>();

const parseDate: Parse = (v) => (typeof v === 'string' ? new Date(v.includes('+') ? v : `${v}+00:00`) : v);
const parseBoolean: Parse = (v) => (v === null || v === undefined ? v : typeof v === 'boolean' ? v : Number(v) !== 0);
const parseJson: Parse = (v) => (typeof v === 'string' ? JSON.parse(v) : v);

/** The conversions a model's columns need, worked out once per model. */
function parsersOf(model: ModelStatic<Model>): Map<string, Parse> {
  let found = parsers.get(model);
  if (found) return found;
  found = new Map();
  for (const [name, attribute] of Object.entries(model.getAttributes())) {
    const key = (attribute.type as { key?: string }).key;
    if (key === 'DATE') found.set(name, parseDate);
    else if (key === 'BOOLEAN') found.set(name, parseBoolean);
    else if (key === 'JSON' || key === 'JSONB') found.set(name, parseJson);
  }
  parsers.set(model, found);
  return found;
}

function hydrate(model: ModelStatic<Model>, row: Record<string, unknown>, includes: Included[]): Record<string, unknown> {
  for (const [name, parse] of parsersOf(model)) {
    if (name in row) row[name] = parse(row[name]);
  }
  for (const inc of includes) {
    const nested = row[inc.as] as Record<string, unknown> | undefined;
    if (!nested) continue;
    // A LEFT JOIN that found nothing comes back as an object of nulls; an instance would hold null.
    const pk = inc.model.primaryKeyAttribute;
    const empty = pk in nested ? nested[pk] === null : Object.values(nested).every((v) => v === null);
    row[inc.as] = empty ? null : hydrate(inc.model, nested, inc.include);
  }
  return row;
}
