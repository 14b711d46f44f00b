import type { Adapter, AdapterPayload } from 'oidc-provider';

interface Stored {
  payload: AdapterPayload;
  expiresAt: number | null;
}

/**
 * oidc-provider's storage, in memory, one store per provider instance. Right for a test
 * provider whose sessions may vanish at restart; a real provider keeps them in a database.
 */
export function memoryAdapterFactory(): new (model: string) => Adapter {
  const store = new Map<string, Stored>();
  const grants = new Map<string, Set<string>>();

  return class MemoryAdapter implements Adapter {
    constructor(private readonly model: string) {}

    private key(id: string): string {
      return `${this.model}:${id}`;
    }

    async upsert(id: string, payload: AdapterPayload, expiresIn: number): Promise<void> {
      const key = this.key(id);
      store.set(key, { payload, expiresAt: expiresIn ? Date.now() + expiresIn * 1000 : null });
      if (payload.grantId) {
        const keys = grants.get(payload.grantId) ?? new Set<string>();
        keys.add(key);
        grants.set(payload.grantId, keys);
      }
    }

    async find(id: string): Promise<AdapterPayload | undefined> {
      const stored = store.get(this.key(id));
      if (!stored) return undefined;
      if (stored.expiresAt !== null && stored.expiresAt < Date.now()) {
        store.delete(this.key(id));
        return undefined;
      }
      return stored.payload;
    }

    async findByUid(uid: string): Promise<AdapterPayload | undefined> {
      for (const [key, stored] of store) {
        if (key.startsWith(`${this.model}:`) && stored.payload.uid === uid) return this.find(key.slice(this.model.length + 1));
      }
      return undefined;
    }

    async findByUserCode(userCode: string): Promise<AdapterPayload | undefined> {
      for (const [key, stored] of store) {
        if (key.startsWith(`${this.model}:`) && stored.payload.userCode === userCode) return this.find(key.slice(this.model.length + 1));
      }
      return undefined;
    }

    async consume(id: string): Promise<void> {
      const stored = store.get(this.key(id));
      if (stored) stored.payload.consumed = Math.floor(Date.now() / 1000);
    }

    async destroy(id: string): Promise<void> {
      store.delete(this.key(id));
    }

    async revokeByGrantId(grantId: string): Promise<void> {
      for (const key of grants.get(grantId) ?? []) store.delete(key);
      grants.delete(grantId);
    }
  };
}
