import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { invalidateProjectSchemes } from './get-schemes.api';
import { schemeSummarySchema, type SchemeSummary } from './scheme.schema';

const importResponseSchema = z.object({
  scheme: schemeSummarySchema,
  repairs: z.array(z.string()).default([]),
  problems: z.array(z.object({ message: z.string() }).passthrough()).default([]),
});

const errorSchema = z.object({
  error: z.object({
    code: z.string().default('error'),
    message: z.string().default('The plan file could not be imported.'),
    problems: z.array(z.object({ message: z.string() }).passthrough()).default([]),
  }),
});

export interface ImportedScheme {
  scheme: SchemeSummary;
  /** What the server's repair step fixed, one sentence each. */
  repairs: string[];
  /** Saved, but worth a look (e.g. a member end that lands on nothing yet). */
  problems: string[];
}

/** The file is not JSON, or the server refused the plan (422 naming each element). */
export class PlanImportError extends Error {
  constructor(
    message: string,
    readonly problems: string[],
  ) {
    super(message);
    this.name = 'PlanImportError';
  }
}

/**
 * Reads a plan file the user chose and imports it as a new scheme. Uses fetch directly
 * because a 422 carries the list of problems, which the shared client does not keep.
 */
export async function importScheme(projectId: string, file: File, name?: string): Promise<ImportedScheme> {
  let plan: unknown;
  try {
    plan = JSON.parse(await file.text());
  } catch {
    throw new PlanImportError(`${file.name} is not a JSON plan file.`, []);
  }
  let response: Response;
  try {
    response = await fetch(`/api/projects/${encodeURIComponent(projectId)}/schemes`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: JSON.stringify(name ? { name, plan } : { plan }),
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach the Baywright server. Check your connection.');
  }
  const payload: unknown = await response.json().catch(() => undefined);
  if (response.ok) {
    const parsed = importResponseSchema.parse(payload);
    return { scheme: parsed.scheme, repairs: parsed.repairs, problems: parsed.problems.map((p) => p.message) };
  }
  const error = errorSchema.safeParse(payload);
  const message = error.success ? error.data.error.message : `The server answered ${response.status}. Try again.`;
  if (response.status === 422) {
    throw new PlanImportError(message, error.success ? error.data.error.problems.map((p) => p.message) : []);
  }
  throw new ApiError(response.status, error.success ? error.data.error.code : `http_${response.status}`, message);
}

export function useImportScheme(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, name }: { file: File; name?: string }) => importScheme(projectId, file, name),
    onSuccess: () => invalidateProjectSchemes(queryClient, projectId),
  });
}
