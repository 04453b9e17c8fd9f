import { z } from 'zod';

const idSchema = z.union([z.string(), z.number()]).transform(String);
const optionalText = z
  .string()
  .nullish()
  .transform((v) => v ?? '');

export const projectSchema = z.object({
  id: idSchema,
  name: z.string(),
  number: optionalText,
  client: optionalText,
  address: optionalText,
  description: optionalText,
  createdAt: z.string(),
  updatedAt: z.string(),
});

export type Project = z.output<typeof projectSchema>;

// What a person types to create or edit a project. Optional fields may be left blank.
export const projectInputSchema = z.object({
  name: z.string().trim().min(1, 'Give the project a name.').max(200, 'Keep the name under 200 characters.'),
  number: z.string().trim().max(50, 'Keep the project number under 50 characters.'),
  client: z.string().trim().max(200, 'Keep the client under 200 characters.'),
  address: z.string().trim().max(300, 'Keep the address under 300 characters.'),
  description: z.string().trim().max(4000, 'Keep the description under 4000 characters.'),
});

export type ProjectInput = z.infer<typeof projectInputSchema>;

/** Blank optional fields are left out of the request rather than sent as "". */
export function toProjectBody(input: ProjectInput): Record<string, string> {
  const body: Record<string, string> = { name: input.name };
  for (const key of ['number', 'client', 'address', 'description'] as const) {
    if (input[key] !== '') body[key] = input[key];
  }
  return body;
}
