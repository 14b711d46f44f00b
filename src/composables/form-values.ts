/**
 * A cleared number field gives '' (Vuetify's v-model.number keeps the text it cannot parse):
 * the API means "no value" by null, so blanks in `numberFields` are sent as null. Text fields
 * keep '' (a blank note is an empty note). Without `numberFields`, every blank becomes null.
 */
export function blanksToNull<T extends object>(values: T, numberFields?: ReadonlyArray<keyof T>): T {
  const converts = (key: string) => !numberFields || numberFields.includes(key as keyof T);
  return Object.fromEntries(Object.entries(values).map(([key, value]) => [key, value === '' && converts(key) ? null : value])) as T;
}
