import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SaveDraftBody } from '@shared/schemas/recipe';
import { aRecipeVersion } from '../../../testing/stock-and-recipe-fixtures';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { AUTOSAVE_DEBOUNCE_MS, DraftAutosave } from './draft-autosave';

describe('DraftAutosave', () => {
  let draft: DraftAutosave;
  let backend: HttpTestingController;

  beforeEach(() => {
    vi.useFakeTimers();
    TestBed.configureTestingModule({
      providers: [
        DraftAutosave,
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Notifier, useValue: { show: vi.fn() } },
        { provide: Session, useValue: { clear: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    draft = TestBed.inject(DraftAutosave);
    draft.adopt(aRecipeVersion({ status: 'draft', contentHash: null, revision: 4 }), true);
  });

  afterEach(() => {
    backend.verify();
    vi.useRealTimers();
  });

  const feed = () => draft.form.controls.content.controls.cutting.controls.feedMmS;
  const saves = () => backend.match({ method: 'PUT', url: '/api/recipes/3/versions/1' });

  it('saves once, AUTOSAVE_DEBOUNCE_MS after the last change, with the revision it was based on', () => {
    feed().setValue(0.4);
    vi.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS - 100);
    feed().setValue(0.3);
    vi.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS - 100);
    expect(saves()).toHaveLength(0);
    expect(draft.saveStatus()).toBe('Unsaved changes');

    vi.advanceTimersByTime(100);
    const [save] = saves();
    expect((save.request.body as SaveDraftBody).revision).toBe(4);
    expect((save.request.body as SaveDraftBody).content.cutting.feedMmS).toBe(0.3);
    expect(draft.saveState()).toBe('saving');
  });

  it('sends one save at a time; a change made meanwhile goes next, on the revision the first one left', async () => {
    feed().setValue(0.4);
    vi.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    const [first] = saves();
    feed().setValue(0.3);
    expect(draft.saveNow()).toBe(true);
    expect(saves()).toHaveLength(0);

    first.flush(aRecipeVersion({ status: 'draft', contentHash: null, revision: 5 }));
    const second = await vi.waitFor(() => {
      const [request] = saves();
      expect(request).toBeDefined();
      return request;
    });
    expect((second.request.body as SaveDraftBody).revision).toBe(5);
    expect((second.request.body as SaveDraftBody).content.cutting.feedMmS).toBe(0.3);
    second.flush(aRecipeVersion({ status: 'draft', contentHash: null, revision: 6 }));
    await vi.waitFor(() => expect(draft.saveState()).toBe('idle'));
    expect(draft.revision()).toBe(6);
  });

  it('knows whether leaving would lose input: not after loading, yes after a change, not once it is saved', async () => {
    expect(draft.unsaved()).toBe(false);
    expect(await draft.canLeave()).toBe(true);
    feed().setValue(0.4);
    expect(draft.unsaved()).toBe(true);
    vi.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    saves()[0].flush(aRecipeVersion({ status: 'draft', contentHash: null, revision: 5 }));
    await vi.waitFor(() => expect(draft.unsaved()).toBe(false));
  });

  it('never autosaves a version that is no longer editable', () => {
    draft.adopt(aRecipeVersion({ status: 'approved' }), true);
    expect(draft.lockedReason()).toContain('Only drafts and versions returned for changes can be edited');
    feed().setValue(0.4);
    vi.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(saves()).toHaveLength(0);
    expect(draft.unsaved()).toBe(false);
  });
});
