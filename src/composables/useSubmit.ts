import { nextTick, ref } from 'vue';
import { ApiError } from '@/api/client';
import { useNotificationsStore } from '@/stores/notifications';

/**
 * One way for a form to save: `saving` while the request runs, the API's field errors on
 * `errors` (by field name, for the inputs' error-messages), everything else in the notice queue.
 * With `fields` (the names the form shows), an error on those fields stays on the form alone;
 * without, the message is also queued, since the form may not show the field it names.
 */
export function useSubmit(options: { fields?: readonly string[] } = {}) {
  const saving = ref(false);
  const errors = ref<Record<string, string>>({});
  const notifications = useNotificationsStore();

  /** Runs `work`; answers whether it succeeded. `success` is the notice shown when it did. */
  async function submit(work: () => Promise<unknown>, success?: string): Promise<boolean> {
    saving.value = true;
    errors.value = {};
    try {
      await work();
      if (success) notifications.push(success, 'success');
      return true;
    } catch (error) {
      const fields = error instanceof ApiError ? Object.entries(error.fields) : [];
      // The first field in error comes into view, so a long form on a phone shows what to fix.
      if (fields.length > 0) void nextTick(() => document.querySelector('.v-input--error')?.scrollIntoView({ block: 'center' }));
      if (options.fields) {
        const shown = fields.filter(([field]) => options.fields!.includes(field.split('.')[0]!));
        errors.value = Object.fromEntries(shown.map(([field, message]) => [field.split('.')[0]!, message]));
        if (shown.length > 0 && shown.length === fields.length) return false;
      } else {
        errors.value = Object.fromEntries(fields);
      }
      notifications.push(error instanceof Error ? error.message : 'Something went wrong', 'error');
      return false;
    } finally {
      saving.value = false;
    }
  }

  function clear(field?: string): void {
    if (field) delete errors.value[field];
    else errors.value = {};
  }

  return { saving, errors, submit, clear };
}
