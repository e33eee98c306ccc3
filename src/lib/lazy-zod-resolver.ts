import type { FieldValues, Resolver } from 'react-hook-form';
import type * as z4 from 'zod/v4/core';

/**
 * A react-hook-form resolver that validates with a shared zod schema loaded on its own, so a form's
 * page paints without waiting for the schema library (about 24 kB gzipped). The schema starts
 * loading as soon as the form's module runs, so it is there long before the first submit; the
 * rules and messages are the schema's own, exactly as with `zodResolver(schema)`.
 */
export function lazyZodResolver<Input extends FieldValues, Output = Input>(
  load: () => Promise<z4.$ZodType<Output, Input>>,
): Resolver<Input, unknown, Output> {
  let ready: Promise<Resolver<Input, unknown, Output>> | null = null;
  const start = () => {
    const p = Promise.all([load(), import('@hookform/resolvers/zod')]).then(
      ([schema, { zodResolver }]) => zodResolver(schema) as Resolver<Input, unknown, Output>,
    );
    // A load that failed (the connection dropped) is tried again on the next validation.
    p.catch(() => {
      if (ready === p) ready = null;
    });
    return p;
  };
  ready = start();
  return async (values, context, options) => (await (ready ??= start()))(values, context, options);
}
