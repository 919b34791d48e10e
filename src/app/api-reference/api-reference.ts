import { HttpClient } from '@angular/common/http';
import { afterNextRender, ChangeDetectionStrategy, Component, DestroyRef, type ElementRef, InjectionToken, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';

/** Draws an OpenAPI document into an element; answers how to take it down again. */
export type RenderApiReference = (target: HTMLElement, document: object) => Promise<() => void>;

/** The viewer, loaded only when this page opens (it is large; no other page needs it). */
export const API_REFERENCE_RENDERER = new InjectionToken<RenderApiReference>('API reference renderer', {
  providedIn: 'root',
  factory: () => async (target, document) => (await import('./swagger-viewer')).renderSwaggerUi(target, document),
});

/**
 * For admins: the server's own API reference (GET /api/openapi.json, generated from its
 * route table), shown with Swagger UI for reading only — no requests are sent from here.
 */
@Component({
  selector: 'kb-api-reference',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './api-reference.html',
  styleUrl: './api-reference.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiReference {
  private readonly http = inject(HttpClient);
  private readonly render = inject(API_REFERENCE_RENDERER);
  private readonly viewer = viewChild.required<ElementRef<HTMLElement>>('viewer');
  private dispose: (() => void) | null = null;

  protected readonly state = signal<'loading' | 'ready' | 'failed'>('loading');

  constructor() {
    afterNextRender(() => void this.show());
    inject(DestroyRef).onDestroy(() => this.dispose?.());
  }

  private async show(): Promise<void> {
    try {
      const document = await firstValueFrom(this.http.get<object>('/api/openapi.json'));
      this.dispose = await this.render(this.viewer().nativeElement, document);
      this.state.set('ready');
    } catch {
      // A failed request has been explained by the error interceptor; the page says so too.
      this.state.set('failed');
    }
  }
}
