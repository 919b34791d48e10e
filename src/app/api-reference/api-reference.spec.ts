import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { API_REFERENCE_RENDERER, ApiReference } from './api-reference';

describe('ApiReference', () => {
  let fixture: ComponentFixture<ApiReference>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  const takeDown = vi.fn();
  const render = vi.fn(async (target: HTMLElement, _document: object) => {
    target.textContent = 'drawn';
    return takeDown;
  });

  beforeEach(async () => {
    render.mockClear();
    takeDown.mockClear();
    TestBed.configureTestingModule({
      imports: [ApiReference],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: API_REFERENCE_RENDERER, useValue: render }],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ApiReference);
    root = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  it("draws the server's document with the viewer, then takes the viewer down when the page closes", async () => {
    expect(root.querySelector('mat-progress-bar')).not.toBeNull();
    const document = { openapi: '3.1.1', paths: {} };
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/openapi.json' }))).flush(document);
    await vi.waitFor(async () => {
      await fixture.whenStable();
      expect(root.querySelector('mat-progress-bar')).toBeNull();
    });
    expect(render).toHaveBeenCalledTimes(1);
    expect(render.mock.calls[0]![1]).toEqual(document);
    expect(root.querySelector('.kb-viewer')!.textContent).toBe('drawn');
    fixture.destroy();
    expect(takeDown).toHaveBeenCalledTimes(1);
  });

  it('says so when the document cannot be loaded, and draws nothing', async () => {
    (await vi.waitFor(() => backend.expectOne('/api/openapi.json'))).flush({ code: 'FORBIDDEN', errors: [] }, { status: 403, statusText: 'Forbidden' });
    await vi.waitFor(async () => {
      await fixture.whenStable();
      expect(root.querySelector('[role="alert"]')?.textContent).toContain('could not be loaded');
    });
    expect(render).not.toHaveBeenCalled();
  });
});
