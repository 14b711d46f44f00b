import type { SignInOptions } from '@contracts/auth.js';
import type { Me, UnitSystem } from '@contracts/users.js';
import { api } from './client';

export type { SignInOptions };

export const sessionApi = {
  me: () => api.get<Me>('/me'),
  setUnitSystem: (unitSystem: UnitSystem) => api.patch<void>('/me/preferences', { unitSystem }),
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
