/**
 * A cleared number field gives '' (Vuetify's v-model.number keeps the text it cannot parse):
 * the API means "no value" by null, so blanks are sent as null.
 */
export function blanksToNull<T extends object>(values: T): T {
  return Object.fromEntries(Object.entries(values).map(([key, value]) => [key, value === '' ? null : value])) as T;
}
