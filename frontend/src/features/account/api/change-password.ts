import type { ChangePasswordRequest } from '@contracts/auth';
import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const changePassword = (body: ChangePasswordRequest) => api.post('/api/account/password', body);

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
