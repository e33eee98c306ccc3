import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Suggestion, SuggestBody } from '@shared/schemas/assignment';

/** A POST because it computes rather than reads a stored thing, but it writes nothing. */
export const suggestAssignments = (body: SuggestBody) => api.post<Suggestion>('/api/matching/suggest', body);

export function useSuggestAssignments() {
  return useMutation({ mutationFn: suggestAssignments });
}
