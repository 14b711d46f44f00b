import type { MailPreferences, MailPreferenceUpdate } from '@contracts/mail.js';
import { api } from './client';

export const mailApi = {
  preferences: () => api.get<MailPreferences>('/mail/preferences'),
  save: (body: MailPreferenceUpdate) => api.put<MailPreferences>('/mail/preferences', body),
};
