import { z } from 'zod';

/** A request built from a form's values: the body, errors of fields that could not become one, and where each request path lands. */
export type BuiltRequest = { request: unknown; errors?: Record<string, string[]>; fieldOf: (path: string) => string | undefined };

/**
 * A form schema for zodResolver where the form holds text and the API wants a differently shaped body: builds the
 * request from the values, validates it with the shared input schema, and puts each problem back under the form
 * field it came from ("root" when none). The submit handler receives the parsed request.
 */
export function requestFormSchema<V, S extends z.ZodType>(schema: S, build: (values: V) => BuiltRequest) {
  return z.custom<V>().transform((values, ctx): z.output<S> => {
    const { request, errors = {}, fieldOf } = build(values);
    const parsed = schema.safeParse(request);
    const issues = Object.entries(errors).map(([path, [message]]) => ({ path, message }));
    if (!parsed.success) for (const i of parsed.error.issues) issues.push({ path: i.path.join('.'), message: i.message });
    for (const { path, message } of issues) ctx.addIssue({ code: 'custom', path: (fieldOf(path) ?? 'root').split('.'), message });
    return issues.length || !parsed.success ? z.NEVER : parsed.data;
  });
}
