import type { EventSourceLike } from '../overview/snapshot-progress';

/** An event stream the test drives (stands in for the browser's EventSource). */
export class FakeEventSource implements EventSourceLike {
  onerror: ((event: Event) => void) | null = null;
  closed = false;
  private readonly listeners = new Map<string, ((event: MessageEvent<string>) => void)[]>();

  constructor(readonly url: string) {}

  addEventListener(type: string, listener: (event: MessageEvent<string>) => void): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }

  close(): void {
    this.closed = true;
  }

  /** Delivers a named event with JSON data, as the server writes it. */
  emit(type: string, data: unknown): void {
    const text = typeof data === 'string' ? data : JSON.stringify(data);
    for (const listener of this.listeners.get(type) ?? []) listener(new MessageEvent(type, { data: text }));
  }

  fail(): void {
    this.onerror?.(new Event('error'));
  }
}
