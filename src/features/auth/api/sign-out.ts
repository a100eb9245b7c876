import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api-client';

export async function signOut(): Promise<void> {
  await api.post('/auth/logout');
  resetCsrfToken(); // the next session gets a token of its own
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.clear() });
}
