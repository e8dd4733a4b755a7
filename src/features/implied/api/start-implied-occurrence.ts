import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { impliedOccurrenceBodySchema } from '../../../../shared/contracts/implied-occurrence.ts';
import { api } from '../../../lib/api-client.ts';

const startedSchema = z.object({ runId: z.string(), sampleId: z.string() });

/**
 * Starts the run that answers the question. 400 names the field (`sampleId` for a sample
 * without counts); 403 at `systems` when an observer asks for more than 10^6 systems; 402
 * when the credit is short.
 */
export function startImpliedOccurrence(body: z.infer<typeof impliedOccurrenceBodySchema>) {
  return api.post('/api/implied-occurrence', { body, schema: startedSchema });
}

export function useStartImpliedOccurrence() {
  return useMutation({ mutationFn: startImpliedOccurrence });
}
