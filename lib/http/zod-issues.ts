import type { z } from 'zod';

export type FieldIssue = { path: string; message: string };

/** zod issues as a flat list of { path, message }, the shape the forms and the API share. */
export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}
