import type { FieldValues, Resolver } from "react-hook-form";

/**
 * A react-hook-form resolver whose schema module loads on the first check (usually the first
 * submit), so a light page such as the sign-in page does not ship zod with its first paint.
 * The service worker precaches the loaded chunk like any other, so the check works offline too.
 */
export function lazyResolver<V extends FieldValues>(load: () => Promise<Resolver<V>>): Resolver<V> {
  let loaded: Promise<Resolver<V>> | null = null;
  return async (values, context, options) => {
    loaded ??= load().catch((error: unknown) => {
      loaded = null; // a failed fetch (no signal) is tried again on the next submit
      throw error;
    });
    return (await loaded)(values, context, options);
  };
}
