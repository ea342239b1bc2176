import { DestroyRef, computed, inject, signal } from '@angular/core';
import { Observable, Subscription } from 'rxjs';
import { ApiError, toApiError } from './api-error';
import { NotifyService } from './notify.service';

/**
 * Loading and error state for one piece of data fetched over HTTP. Create it in a component's
 * injection context; `run()` replaces any request still in flight.
 */
export class LoadState<T> {
  private readonly notify = inject(NotifyService);
  private sub: Subscription | null = null;
  /** The last value loaded. */
  readonly value = signal<T | null>(null);
  /** Whether a request is in flight. */
  readonly loading = signal(false);
  /** The last error, until the next successful load. */
  readonly error = signal<ApiError | null>(null);
  /** Whether the last load answered 404 (not there, or not the user's to see). */
  readonly notFound = computed(() => this.error()?.status === 404);

  constructor(private readonly options: { snackOnError?: boolean } = {}) {
    inject(DestroyRef).onDestroy(() => this.sub?.unsubscribe());
  }

  /** Starts loading; `then` runs with the value once it arrives. */
  run(source: Observable<T>, then?: (value: T) => void): void {
    this.sub?.unsubscribe();
    this.loading.set(true);
    this.sub = source.subscribe({
      next: (v) => {
        this.value.set(v);
        this.error.set(null);
        this.loading.set(false);
        then?.(v);
      },
      error: (err: unknown) => {
        const e = toApiError(err);
        this.error.set(e);
        this.loading.set(false);
        if (this.options.snackOnError !== false && e.status !== 404) this.notify.error(e);
      },
    });
  }
}
