import { DOCUMENT } from '@angular/common';
import { type EnvironmentProviders, inject, provideAppInitializer } from '@angular/core';
import { toneCustomProperties } from '@shared/status-colours';

/**
 * Publishes the shared status tones (shared/status-colours.ts) as CSS custom properties on
 * <html> before the first screen renders, so stylesheets colour statuses with
 * `var(--kb-tone-go-ink)` and friends and never keep a copy of the values.
 */
export function provideStatusTones(): EnvironmentProviders {
  return provideAppInitializer(() => {
    const root = inject(DOCUMENT).documentElement;
    for (const [name, value] of Object.entries(toneCustomProperties())) root.style.setProperty(name, value);
  });
}
