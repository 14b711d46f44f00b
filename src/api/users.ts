import type { Page } from '@contracts/paging.js';
import type { CreateUserRequest, UpdateUserRequest, UserView } from '@contracts/users.js';
import { api, type Query, type RequestOf } from './client';

export const usersApi = {
  page: (query: Query) => api.get<Page<UserView>>('/users', query),
  siteOptions: () => api.get<{ items: Array<{ id: string; name: string; companyName: string }> }>('/users/site-options'),
  create: (body: RequestOf<typeof CreateUserRequest>) => api.post<UserView>('/users', body),
  update: (id: string, body: RequestOf<typeof UpdateUserRequest>) => api.patch<UserView>(`/users/${id}`, body),
};
