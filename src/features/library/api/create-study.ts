import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { referenceStudy } from '../../../../shared/solver/demo-cards';

export type NewStudyInput =
  | { partId: number; title: string; from: 'reference' }
  | { partId: number; title: string; from: 'revision'; studyId: number; number: number };
export type CreatedStudy = { id: number; title: string };

/**
 * A new study in a part: from the reference study's inputs, or from a chosen
 * revision (a fork into this part, so the new study remembers its origin).
 */
export function createStudy(input: NewStudyInput): Promise<CreatedStudy> {
  if (input.from === 'reference') {
    return api.post<CreatedStudy>(`/parts/${input.partId}/studies`, { title: input.title, message: 'Started from the reference study', params: referenceStudy() });
  }
  return api.post<CreatedStudy>(`/studies/${input.studyId}/revisions/${input.number}/fork`, { partId: input.partId, title: input.title });
}

export function useCreateStudy() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStudy,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: ['parts'] });
      void queryClient.invalidateQueries({ queryKey: ['teams'] });
    },
  });
}
