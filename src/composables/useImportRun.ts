import { computed, ref } from 'vue';
import { importRunsApi, type ImportRunView } from '@/api/import-runs';

const stageWords: Record<ImportRunView['status'], string> = {
  reading: 'Reading rows',
  checking: 'Checking rows',
  writing: 'Writing results',
  done: 'Done',
  failed: 'Stopped',
};

/**
 * Follows an import run on the server while its request is open: a new run id per import, and
 * what the run is at, read twice a second until it ends.
 */
export function useImportRun() {
  const run = ref<ImportRunView | null>(null);
  let timer: ReturnType<typeof setInterval> | undefined;

  function follow(): string {
    const id = crypto.randomUUID();
    run.value = null;
    stop();
    timer = setInterval(async () => {
      try {
        run.value = await importRunsApi.get(id);
      } catch {
        // Not started yet (the upload is still going): asked again on the next tick.
      }
    }, 500);
    return id;
  }

  function stop(): void {
    if (timer) clearInterval(timer);
    timer = undefined;
  }

  const text = computed(() => {
    if (!run.value) return null;
    const { status, rowsDone, rowsTotal, timeLimitSeconds } = run.value;
    const count = rowsTotal > 0 ? `${rowsDone} of ${rowsTotal}` : rowsDone > 0 ? `${rowsDone}` : '';
    return `${stageWords[status]} ${count} · stops after ${Math.round(timeLimitSeconds / 60)} min, writing nothing`.replace('  ', ' ');
  });
  const fraction = computed(() => (run.value && run.value.rowsTotal > 0 ? run.value.rowsDone / run.value.rowsTotal : null));

  return { run, text, fraction, follow, stop };
}
