import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const signOut = () => api.post('/api/auth/logout', {});

/**
 * After signing out the caller reloads the page at /sign-in: a fresh document is the surest
 * way to leave nothing of the previous person's data in memory.
 */
export function useSignOut() {
  return useMutation({ mutationFn: signOut });
}
