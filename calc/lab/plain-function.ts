import type { z } from 'zod';

/**
 * Turns a registry compute function into a plain typed function for callers outside the registry
 * (the server): it validates the raw input and applies the schema's defaults first, so a caller can
 * omit optional fields exactly as over the CLI. Throws the zod error on invalid input.
 */
export function plainFunction<S extends z.ZodType, O>(schema: S, compute: (input: z.output<S>) => O) {
  return (input: z.input<S>): O => compute(schema.parse(input));
}
