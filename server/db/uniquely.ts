import { conflict } from '../errors/app-error.js';

/** Turns a unique-constraint violation (23505) into a 409 on the named field. */
export async function uniquely<T>(work: () => Promise<T>, field: string, message: string): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if ((error as { code?: string }).code === '23505') throw conflict(message, { [field]: message });
    throw error;
  }
}
