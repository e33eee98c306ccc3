import type { FieldValues, Resolver } from 'react-hook-form';
import type * as z4 from 'zod/v4/core';

/**
 * Starts loading a module at once and hands back a getter for it, so a form's page paints without
 * waiting for the schema library (about 24 kB gzipped) and the schema is there long before the
 * first submit. A load that failed (the connection dropped) is tried again on the next call.
 */
export function preload<T>(load: () => Promise<T>): () => Promise<T> {
  let ready: Promise<T> | null = null;
  const start = () => {
    const p = load();
    p.catch(() => {
      if (ready === p) ready = null;
    });
    return p;
  };
  ready = start();
  return () => (ready ??= start());
}

/**
 * A react-hook-form resolver that validates with a shared zod schema loaded on its own (see
 * `preload`); the rules and messages are the schema's own, exactly as with `zodResolver(schema)`.
 */
export function lazyZodResolver<Input extends FieldValues, Output = Input>(
  load: () => Promise<z4.$ZodType<Output, Input>>,
): Resolver<Input, unknown, Output> {
  const resolver = preload(() =>
    Promise.all([load(), import('@hookform/resolvers/zod')]).then(([schema, { zodResolver }]) => zodResolver(schema) as Resolver<Input, unknown, Output>),
  );
  return async (values, context, options) => (await resolver())(values, context, options);
}
