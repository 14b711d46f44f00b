import { ref } from 'vue';
import { ApiError } from '@/api/client';
import { useNotificationsStore } from '@/stores/notifications';

/**
 * Maps an API error's `fields` onto a form: `errors.email` is the server's message for the
 * e-mail field. Errors that name no field of the form go to the notice queue.
 */
export function useFieldErrors(formFields: readonly string[]) {
  const errors = ref<Record<string, string>>({});
  const notifications = useNotificationsStore();

  function clear(field?: string): void {
    if (field) delete errors.value[field];
    else errors.value = {};
  }

  function absorb(error: unknown): void {
    if (error instanceof ApiError && Object.keys(error.fields).length > 0) {
      const known = Object.entries(error.fields).filter(([field]) => formFields.includes(field.split('.')[0]!));
      errors.value = Object.fromEntries(known.map(([field, message]) => [field.split('.')[0]!, message]));
      if (known.length < Object.keys(error.fields).length) notifications.push(error.message, 'error');
      return;
    }
    notifications.push(error instanceof Error ? error.message : 'Something went wrong', 'error');
  }

  return { errors, clear, absorb };
}
