import type { DataSource } from 'typeorm';
import { mailKindWords, mandatoryKinds, type MailKind, type MailPreferences, type MailPreferenceUpdate } from '../../contracts/mail.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { invalid } from '../../errors/app-error.js';
import { preferencesOf, savePreference } from '../../kernel/mail/mail-preferences.js';
import { findActiveRole } from './mail-preferences.repository.js';

export type UnsubscribeOutcome = 'done' | 'mandatory' | 'unknown-person';

/** Each person's choice of how each kind of mail reaches them, and the way out from a mail. */
export class MailPreferencesService {
  constructor(private readonly dataSource: DataSource) {}

  async get(user: CurrentUser): Promise<MailPreferences> {
    return { items: await preferencesOf(this.dataSource, user.id, user.role) };
  }

  async update(user: CurrentUser, request: MailPreferenceUpdate): Promise<MailPreferences> {
    const mandatory = mandatoryKinds(user.role);
    const refused = request.items.findIndex((item) => mandatory.includes(item.kind) && item.delivery !== 'now');
    if (refused >= 0) {
      const kind = request.items[refused]!.kind;
      throw invalid({
        [`items.${refused}.delivery`]: `${mailKindWords[kind].title} reaches a coordinator at once; it cannot be turned off`,
      });
    }
    await this.dataSource.transaction(async (manager) => {
      for (const item of request.items) await savePreference(manager, user.id, item.kind, item.delivery);
    });
    return this.get(user);
  }

  /** Turns one kind off for the person a verified unsubscribe token names. */
  async unsubscribe(userId: string, kind: MailKind): Promise<UnsubscribeOutcome> {
    const person = await findActiveRole(this.dataSource, userId);
    if (!person) return 'unknown-person';
    if (mandatoryKinds(person.role).includes(kind)) return 'mandatory';
    await savePreference(this.dataSource, userId, kind, 'off');
    return 'done';
  }
}
