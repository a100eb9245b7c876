import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { getMe } from './get-me';

export async function signOut(): Promise<void> {
  await getMe(); // a fresh CSRF token for this session
  await api.post('/auth/logout');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.clear() });
}
