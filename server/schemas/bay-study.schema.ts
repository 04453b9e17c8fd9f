import { z } from 'zod';
import { schemeName } from './scheme.schema';

// Request shapes of the bay study API. The study request itself (region, ranges) is checked
// by parseStudySpec in the service, which answers 422 naming each field.

export const studyBody = z.record(z.string(), z.unknown(), { error: 'The study request must be a JSON object' });

export const studyParams = z.object({
  id: z.uuid({ error: 'Must be a valid id' }),
  studyId: z.uuid({ error: 'Must be a valid study id' }),
});

export const studySchemeBody = z.object({
  optionId: z.string({ error: 'optionId is required: the id of one of the study’s options' }).min(1, 'optionId is required'),
  name: schemeName.optional(),
});
