import "server-only";

/**
 * A small cache of results by key, oldest out first, that keeps settled values and never a
 * promise made during a request: Node stamps the request's AsyncLocalStorage store on every
 * promise created inside it, so a kept promise would keep that request's whole store (request,
 * response, session, the render) for as long as the entry lives. A result still being made is
 * shared by the callers asking meanwhile, and forgotten if it fails.
 */
export class KeptResults<T> {
  private readonly values = new Map<string, T>();
  private readonly pending = new Map<string, Promise<T>>();

  constructor(private readonly entries: number) {}

  get size(): number {
    return this.values.size;
  }

  /** The kept value for `key` (now the newest), the one being made, or a new one from `make`. */
  get(key: string, make: () => Promise<T>): Promise<T> {
    if (this.values.has(key)) {
      const value = this.values.get(key) as T;
      this.values.delete(key);
      this.values.set(key, value);
      return Promise.resolve(value);
    }
    const inFlight = this.pending.get(key);
    if (inFlight) return inFlight;
    const made = make();
    this.pending.set(key, made);
    made.then(
      (value) => {
        this.pending.delete(key);
        this.values.set(key, value);
        if (this.values.size > this.entries) this.values.delete(this.values.keys().next().value as string);
      },
      () => this.pending.delete(key),
    );
    return made;
  }
}
