import { ref } from 'vue';
import { ApiError } from '@/api/client';

/** A record the person cannot see, that does not exist, or whose address is not an id at all. */
export const isMissing = (error: unknown): boolean =>
  error instanceof ApiError && (error.status === 404 || (error.status === 400 && 'id' in error.fields));

/**
 * A record page's load: `missing` turns true when the record is not there for this person, so the
 * page shows the not-found page instead of waiting forever (or an empty edit form).
 */
export function useMissingRecord() {
  const missing = ref(false);
  async function load<T>(fetch: () => Promise<T>): Promise<T | undefined> {
    missing.value = false;
    try {
      return await fetch();
    } catch (error) {
      if (isMissing(error)) {
        missing.value = true;
        return undefined;
      }
      throw error;
    }
  }
  return { missing, load };
}
