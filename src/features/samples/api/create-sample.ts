import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateSampleBody } from '../../../../shared/contracts/samples.ts';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { samplesKey } from './get-samples.ts';

/** 201 with the new sample's id; 400 names the field at fault ("bins.0.magnetic"). */
export function createSample(body: CreateSampleBody) {
  return api.post('/api/samples', { body, schema: idResponseSchema });
}

export function useCreateSample(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSample,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: samplesKey(departmentId) }),
  });
}
