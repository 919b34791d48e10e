import { type Resource, type Signal, linkedSignal } from '@angular/core';

/**
 * A resource's value that stays on screen while the next one loads and when loading it fails
 * (a table keeps its rows instead of jumping empty); `initial` before the first answer and
 * while the resource has nothing to load.
 */
export function latestValue<T>(resource: Resource<T | undefined>, initial: T): Signal<T> {
  return linkedSignal<{ value: T | undefined; idle: boolean }, T>({
    source: () => ({ value: resource.hasValue() ? resource.value() : undefined, idle: resource.status() === 'idle' }),
    computation: (now, previous) => (now.idle ? initial : (now.value ?? previous?.value ?? initial)),
  });
}
