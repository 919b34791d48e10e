import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import type { AttachmentDto } from '@shared/recipe-types';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { PhotoUploads } from './photo-uploads';
import { RecipeAttachments } from './recipe-attachments';

const URL = '/api/recipes/3/versions/1/attachments';

const UPLOADED: AttachmentDto = {
  id: 41,
  role: 'setup',
  caption: 'Vise and backstop',
  fileName: 'setup.png',
  mimeType: 'image/png',
  sizeBytes: 2048,
  width: 640,
  height: 480,
  url: '/api/attachments/41',
  thumbnailUrl: '/api/attachments/41/thumbnail',
  sha256: 'a'.repeat(64),
};

describe('RecipeAttachments', () => {
  let fixture: ComponentFixture<RecipeAttachments>;
  let backend: HttpTestingController;
  let uploads: PhotoUploads;
  let root: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [RecipeAttachments],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        PhotoUploads,
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    uploads = TestBed.inject(PhotoUploads);
    fixture = TestBed.createComponent(RecipeAttachments);
    fixture.componentRef.setInput('recipeId', 3);
    fixture.componentRef.setInput('version', 1);
    fixture.componentRef.setInput('attachments', []);
    root = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function choose(name = 'setup.png'): Promise<void> {
    const input = root.querySelector<HTMLInputElement>('input[type="file"]')!;
    const file = new File([new Uint8Array(2048)], name, { type: 'image/png' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  it('uploads a chosen photo at once, with the role and caption set, and lists it', async () => {
    const caption = root.querySelector<HTMLInputElement>('input[maxlength="300"]')!;
    caption.value = 'Vise and backstop';
    caption.dispatchEvent(new Event('input'));
    await choose();
    // No second step: the file is on its way as soon as it is chosen.
    const request = backend.expectOne({ method: 'POST', url: URL });
    const body = request.request.body as FormData;
    expect(body.get('caption')).toBe('Vise and backstop');
    expect(body.get('role')).toBe('setup');
    expect(uploads.pending()).toMatch(/setup\.png is still uploading/);
    request.flush(UPLOADED);
    await fixture.whenStable();
    expect(root.textContent).toContain('Vise and backstop');
    expect(uploads.pending()).toBe('');
  });

  it('keeps a photo that failed to upload, says so, and sends it again on request', async () => {
    await choose();
    backend.expectOne(URL).flush({ code: 'INTERNAL', message: 'Disk full' }, { status: 500, statusText: 'Server Error' });
    await fixture.whenStable();
    expect(uploads.pending()).toMatch(/setup\.png is not uploaded/);
    expect(root.querySelector('[role="alert"]')?.textContent).toMatch(/not uploaded/);
    [...root.querySelectorAll('button')].find((b) => b.textContent?.includes('Try again'))!.click();
    backend.expectOne(URL).flush(UPLOADED);
    await fixture.whenStable();
    expect(uploads.pending()).toBe('');
  });
});
