/**
 * The settings version a period uses: the one in force on its first day, or for a day before
 * the first version, that first version. The database's `permit_settings_on()` answers the same.
 */
export function settingsOn<V extends { appliesFrom: string }>(versions: V[], day: string): V | undefined {
  const started = versions.filter((v) => v.appliesFrom <= day).sort((a, b) => (a.appliesFrom < b.appliesFrom ? 1 : -1));
  return started[0] ?? [...versions].sort((a, b) => (a.appliesFrom < b.appliesFrom ? -1 : 1))[0];
}
