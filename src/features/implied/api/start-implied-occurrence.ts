import { useMutation } from '@tanstack/react-query';
import { impliedOccurrenceStartedSchema, type ImpliedOccurrenceBody } from '../../../../shared/contracts/implied-occurrence.ts';
import { api } from '../../../lib/api-client.ts';

/**
 * Asks the question: queues the one-parameter fit over the multiplier. 400 names the field
 * (`sampleId` for a sample without counts); 403 at `systems` when an observer asks for more than
 * 10^6 systems per grid point; 402 when the credit for every grid point is short.
 */
export function startImpliedOccurrence(body: ImpliedOccurrenceBody) {
  return api.post('/api/implied-occurrence', { body, schema: impliedOccurrenceStartedSchema });
}

export function useStartImpliedOccurrence() {
  return useMutation({ mutationFn: startImpliedOccurrence });
}
