import { useEffect, useState } from 'react';
import type { FieldValues, Resolver } from 'react-hook-form';
import type * as z4 from 'zod/v4/core';

/**
 * Starts loading a module at once and hands back a getter for it, so a form's page paints without
 * waiting for the schema library (about 24 kB gzipped) and the schema is there long before the
 * first submit. A load that failed (the connection dropped) is tried again on the next call.
 */
export function preload<T>(load: () => Promise<T>): Preloaded<T> {
  let ready: Promise<T> | null = null;
  const start = () => {
    const p = load();
    p.then(
      (value) => {
        get.loaded = { value };
      },
      () => {
        if (ready === p) ready = null;
      },
    );
    return p;
  };
  const get: Preloaded<T> = () => (ready ??= start());
  ready = start();
  return get;
}

/** A module being loaded by `preload`; `loaded` is set once it has arrived. */
export interface Preloaded<T> {
  (): Promise<T>;
  loaded?: { value: T };
}

/**
 * The preloaded module once it has arrived (undefined until then), for checks that run while a
 * person types: the page paints and works first, the checks join in a moment later.
 */
export function usePreloaded<T>(get: Preloaded<T>): T | undefined {
  const [loaded, setLoaded] = useState(() => get.loaded);
  useEffect(() => {
    if (loaded) return;
    let live = true;
    get().then(
      (value) => live && setLoaded({ value }),
      () => {},
    );
    return () => {
      live = false;
    };
  }, [get, loaded]);
  return (loaded ?? get.loaded)?.value;
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
