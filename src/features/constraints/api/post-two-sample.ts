import { useMutation } from '@tanstack/react-query';
import { twoSampleResponseSchema, type TwoSampleBody } from '../../../../shared/contracts/constraints.ts';
export type { TwoSampleResponse } from '../../../../shared/contracts/constraints.ts';
import { api } from '../../../lib/api-client.ts';

/** Fisher's exact test of two observed samples; 400 names the field ("b.magnetic"). */
export function postTwoSample(body: TwoSampleBody) {
  return api.post('/api/stats/two-sample', { body, schema: twoSampleResponseSchema });
}

export function useTwoSample() {
  return useMutation({ mutationFn: postTwoSample });
}
