import type { Me } from '@contracts/users.js';
import { api } from './client';

export interface SignInOptions {
  demo: { password: string; accounts: Array<{ email: string; name: string; role: string; duty: string }> } | null;
}

export const sessionApi = {
  me: () => api.get<Me>('/me'),
  options: () => api.get<SignInOptions>('/auth/options'),
  signOut: () => api.post<{ redirectTo: string }>('/auth/sign-out'),
  signInUrl: (returnTo?: string, loginHint?: string) => {
    const params = new URLSearchParams();
    if (returnTo) params.set('returnTo', returnTo);
    if (loginHint) params.set('loginHint', loginHint);
    const query = params.toString();
    return `/api/auth/sign-in${query ? `?${query}` : ''}`;
  },
};
