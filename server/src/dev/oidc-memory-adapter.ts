/**
 * A small in-memory storage adapter for the stand-in identity provider
 * (the adapter interface of the oidc-provider package). The stand-in keeps
 * its sessions only while it runs, which is what a local stand-in needs.
 */
interface Entry {
  payload: Record<string, unknown>;
  expiresAt: number | null;
}

const store = new Map<string, Entry>();
const byUid = new Map<string, string>();
const byUserCode = new Map<string, string>();
const grants = new Map<string, Set<string>>();

export class MemoryAdapter {
  constructor(private readonly model: string) {}

  private key(id: string) {
    return `${this.model}:${id}`;
  }

  async upsert(id: string, payload: Record<string, unknown>, expiresIn?: number) {
    const key = this.key(id);
    store.set(key, { payload, expiresAt: expiresIn ? Date.now() + expiresIn * 1000 : null });
    if (typeof payload.uid === 'string') byUid.set(payload.uid, id);
    if (typeof payload.userCode === 'string') byUserCode.set(payload.userCode, id);
    if (typeof payload.grantId === 'string') {
      const set = grants.get(payload.grantId) ?? new Set<string>();
      set.add(key);
      grants.set(payload.grantId, set);
    }
  }

  async find(id: string) {
    const entry = store.get(this.key(id));
    if (!entry) return undefined;
    if (entry.expiresAt !== null && entry.expiresAt < Date.now()) {
      store.delete(this.key(id));
      return undefined;
    }
    return entry.payload;
  }

  async findByUid(uid: string) {
    const id = byUid.get(uid);
    return id ? this.find(id) : undefined;
  }

  async findByUserCode(userCode: string) {
    const id = byUserCode.get(userCode);
    return id ? this.find(id) : undefined;
  }

  async consume(id: string) {
    const entry = store.get(this.key(id));
    if (entry) entry.payload.consumed = Math.floor(Date.now() / 1000);
  }

  async destroy(id: string) {
    store.delete(this.key(id));
  }

  async revokeByGrantId(grantId: string) {
    for (const key of grants.get(grantId) ?? []) store.delete(key);
    grants.delete(grantId);
  }
}
