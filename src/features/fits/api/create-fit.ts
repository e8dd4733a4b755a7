import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { createFitBodySchema } from '../../../../shared/contracts/fits.ts';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { fitsKey } from './get-fits.ts';

/** Queues a fit. 400 names the field at fault ("parameters[0].max"), 402 when the credit does not cover every grid point, 403 for observers. */
export function createFit(body: z.input<typeof createFitBodySchema>) {
  return api.post('/api/fits', { body, schema: idResponseSchema });
}

export function useCreateFit(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFit,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fitsKey(departmentId) }),
  });
}
