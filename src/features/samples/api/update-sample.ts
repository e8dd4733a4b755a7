import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sampleSchema, type CreateSampleBody } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';
import { getSampleQueryOptions } from './get-sample.ts';
import { samplesKey } from './get-samples.ts';

export interface UpdateSampleInput {
  id: string;
  body: CreateSampleBody;
}

/** Replaces the sample's numbers; 403 for a library entry (read-only). */
export function updateSample({ id, body }: UpdateSampleInput) {
  return api.put(`/api/samples/${encodeURIComponent(id)}`, { body, schema: sampleSchema });
}

export function useUpdateSample(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSample,
    onSuccess: (sample) => {
      queryClient.setQueryData(getSampleQueryOptions(departmentId, sample.id).queryKey, sample);
      return queryClient.invalidateQueries({ queryKey: samplesKey(departmentId) });
    },
  });
}
