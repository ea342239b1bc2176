import { InjectionToken } from '@angular/core';
import { Observable } from 'rxjs';

/** What the app needs of the browser's `EventSource` constructor (a spec provides a fake). */
export type EventSourceConstructor = new (url: string, init?: EventSourceInit) => Pick<EventSource, 'addEventListener' | 'close'>;

/** The browser's `EventSource`, or null where there is none (jsdom, some embedded browsers). */
export const EVENT_SOURCE = new InjectionToken<EventSourceConstructor | null>('EVENT_SOURCE', {
  providedIn: 'root',
  factory: () => (typeof EventSource === 'function' ? EventSource : null),
});

/**
 * The JSON messages of one event type on a server-sent event stream (same origin, the session cookie
 * goes along). Completes after the message `isLast` accepts and closes the stream; errors when the
 * stream fails or ends before that (the browser would only reconnect) or a message is not JSON.
 * Unsubscribing closes the stream.
 */
export function serverEvents<T>(Source: EventSourceConstructor, url: string, type: string, isLast: (value: T) => boolean): Observable<T> {
  return new Observable<T>((subscriber) => {
    const source = new Source(url, { withCredentials: true });
    source.addEventListener(type, (event) => {
      let value: T;
      try {
        value = JSON.parse((event as MessageEvent<string>).data) as T;
      } catch (err) {
        source.close();
        subscriber.error(err);
        return;
      }
      subscriber.next(value);
      if (isLast(value)) {
        source.close();
        subscriber.complete();
      }
    });
    source.addEventListener('error', () => {
      source.close();
      subscriber.error(new Error(`The event stream ${url} failed`));
    });
    return () => source.close();
  });
}
